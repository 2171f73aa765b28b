import { afterAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { testDatabase } from "../support/database";

/*
 * The test database is seeded afresh by `npm test`. Nothing here checks the demo's invented
 * values; only that its audit trail accounts for each version it wrote, as commitVersion's do.
 */

interface SeedVersion {
  trialId: string;
  assessmentId: string;
  createdById: string;
  rowsAdded: number;
  scopePlotIds: string[] | null;
}

interface SeedEvent {
  trialId: string;
  userId: string;
  entityId: string;
  action: string;
  summary: string;
  oldValue: unknown;
  newValue: unknown;
  source: string;
  reason: string | null;
  afterLock: boolean;
}

afterAll(async () => {
  await testDatabase().close();
});

describe("the demo's version 1 of every assessment", () => {
  it("has one audit event each, in the shape commitVersion writes, from the demo seed", async () => {
    const sequelize = testDatabase();
    const versions = await sequelize.query<SeedVersion>(
      `SELECT v.trial_id AS "trialId", v.assessment_id AS "assessmentId", v.created_by_id AS "createdById", v.rows_added AS "rowsAdded", v.scope_plot_ids AS "scopePlotIds"
         FROM dataset_versions v JOIN users u ON u.id = v.created_by_id
        WHERE v.number = 1 AND u.email = 'technician@hoebench.test' AND v.upload_id IS NULL
          AND v.trial_id IN (SELECT trial_id FROM audit_events WHERE source = 'demo seed')`,
      { type: QueryTypes.SELECT },
    );
    const events = await sequelize.query<SeedEvent>(
      `SELECT trial_id AS "trialId", user_id AS "userId", entity_id AS "entityId", action, summary, old_value AS "oldValue", new_value AS "newValue",
              source, reason, after_lock AS "afterLock"
         FROM audit_events WHERE source = 'demo seed' AND entity_type = 'assessment-data'`,
      { type: QueryTypes.SELECT },
    );
    // Three demo trials collect data, each with several assessments.
    expect(new Set(versions.map((version) => version.trialId)).size).toBe(3);
    expect(events).toHaveLength(versions.length);
    for (const version of versions) {
      const matching = events.filter((event) => event.entityId === version.assessmentId);
      expect(matching).toEqual([
        {
          trialId: version.trialId,
          userId: version.createdById,
          entityId: version.assessmentId,
          action: "create",
          summary: `Version 1: ${version.rowsAdded} values for the whole assessment (0 replaced)`,
          oldValue: null,
          newValue: { version: 1, rowsAdded: version.rowsAdded, rowsReplaced: 0 },
          source: "demo seed",
          reason: null,
          afterLock: false,
        },
      ]);
      expect(version.scopePlotIds).toBeNull();
    }
  });
});
