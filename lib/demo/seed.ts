import { execFile } from "node:child_process";
import path from "node:path";
import { promisify } from "node:util";
import type { Sequelize } from "sequelize";
import { hashPassword } from "@/lib/auth/password";
import { randomizeLayout } from "@/lib/layout/randomize";
import { Assessment, Membership, Plot, Site, Treatment, Trial, User } from "@/models";
import { seedDemoObservations } from "./demo-observations";
import { demoMemberships, demoProtocols, demoSites, demoTrials, demoUsers, DEMO_PASSWORD } from "./scenario";

/** A connection's database as a URL, so a child process reaches the same one. */
function databaseUrlOf(sequelize: Sequelize): string {
  const { username, password, host, port, database } = sequelize.config;
  const credentials = `${encodeURIComponent(username)}${password ? `:${encodeURIComponent(password)}` : ""}`;
  return `postgres://${credentials}@${host}:${port}/${encodeURIComponent(database)}`;
}

/*
 * The seed runs in plain Node (tsx), outside Next's server build: there modules marked
 * server-only refuse to load, and db() would open the configured database rather than the one
 * being seeded. Publishing goes through the app's own path all the same, in a child process
 * under the react-server condition (as bench:load runs) pointed at this database.
 */
async function publishDemoTrials(sequelize: Sequelize, trialIds: string[]): Promise<void> {
  if (trialIds.length === 0) return;
  const root = path.resolve(__dirname, "../..");
  try {
    await promisify(execFile)(path.join(root, "node_modules/.bin/tsx"), ["--conditions=react-server", path.join(__dirname, "publish-demo-trials.ts"), ...trialIds], {
      cwd: root,
      env: { ...process.env, DATABASE_URL: databaseUrlOf(sequelize), DATABASE_POOL_MAX: "2" },
    });
  } catch (error) {
    const stderr = (error as { stderr?: string }).stderr?.trim();
    throw new Error(stderr || (error as Error).message);
  }
}

/** Seeds the demo into an empty database; a database with any user is left as it is. */
export async function seedDemo(sequelize: Sequelize): Promise<"seeded" | "already-present"> {
  if ((await User.count()) > 0) return "already-present";
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const toPublish: string[] = [];
  await sequelize.transaction(async (transaction) => {
    const users = new Map<string, User>();
    for (const demo of demoUsers) {
      users.set(demo.key, await User.create({ email: demo.email, name: demo.name, role: demo.role, passwordHash }, { transaction }));
    }
    const sites = new Map<string, Site>();
    for (const demo of demoSites) {
      const { key, ...fields } = demo;
      sites.set(key, await Site.create({ ...fields, latitude: null, longitude: null, createdById: users.get("researcher")!.id }, { transaction }));
    }
    const trials = new Map<string, Trial>();
    for (const demo of demoTrials) {
      // A trial the demo shows as published starts locked, as if signed off, and is published below like any other.
      const status = demo.status === "published" ? "locked" : demo.status;
      trials.set(
        demo.key,
        await Trial.create(
          {
            title: demo.title,
            crop: demo.crop,
            season: demo.season,
            siteId: sites.get(demo.site)!.id,
            objective: demo.objective,
            design: "rcbd",
            blocks: demo.blocks,
            plotLengthM: 6,
            plotWidthM: 1.5,
            harvestAreaM2: 4.5,
            quadratAreaM2: 0.25,
            plantingDate: demo.plantingDate,
            randomSeed: demo.randomSeed,
            serpentine: demoProtocols[demo.key]?.serpentine ?? false,
            status,
            ownerId: users.get(demo.owner)!.id,
          },
          { transaction },
        ),
      );
    }
    for (const [key, protocol] of Object.entries(demoProtocols)) {
      const trial = trials.get(key)!;
      const treatments: Treatment[] = [];
      for (const [index, treatment] of protocol.treatments.entries()) {
        treatments.push(await Treatment.create({ ...treatment, trialId: trial.id, position: index + 1, equipmentCost: null, equipmentLifeYears: null, equipmentHaPerYear: null }, { transaction }));
      }
      // The same call the app makes, so the demo layout is what the stored seed gives.
      const planned = randomizeLayout({ design: trial.design, treatmentCount: treatments.length, blocks: trial.blocks, seed: trial.randomSeed, serpentine: trial.serpentine });
      await Plot.bulkCreate(
        planned.map(({ treatmentIndex, ...plot }) => ({ ...plot, trialId: trial.id, treatmentId: treatments[treatmentIndex].id })),
        { transaction },
      );
      for (const [index, assessment] of protocol.assessments.entries()) {
        await Assessment.create({ ...assessment, trialId: trial.id, position: index + 1, plannedDate: null }, { transaction });
      }
    }
    for (const demo of demoMemberships) {
      await Membership.create({ trialId: trials.get(demo.trial)!.id, userId: users.get(demo.user)!.id, role: demo.role }, { transaction });
    }
    await seedDemoObservations(sequelize, transaction);
    // A published trial was signed off by its reviewer first: the review history says so.
    for (const demo of demoTrials.filter((candidate) => candidate.status === "published")) {
      const reviewer = demoMemberships.find((membership) => membership.trial === demo.key && membership.role === "reviewer");
      if (!reviewer) continue;
      await sequelize.query(
        `INSERT INTO review_requests (id, trial_id, status, requested_by_id, message, decided_by_id, decided_at, decision_note, created_at, updated_at)
         VALUES (gen_random_uuid(), :trialId, 'approved', :ownerId, 'All assessments are in; ready for review.', :reviewerId, now(), 'Tables and assumption checks read; approved for publication.', now(), now())`,
        { replacements: { trialId: trials.get(demo.key)!.id, ownerId: users.get(demo.owner)!.id, reviewerId: users.get(reviewer.user)!.id }, transaction },
      );
    }
    toPublish.push(...demoTrials.filter((demo) => demo.status === "published").map((demo) => trials.get(demo.key)!.id));
  });
  await publishDemoTrials(sequelize, toPublish);
  return "seeded";
}
