import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { Membership, Upload, User } from "@/models";
import { createTrialFixture, removeTrialFixtures, type TrialFixture } from "../factories/trials";
import { testDatabase } from "../support/database";
import { signedInAs, type TestClient } from "../support/http";

/*
 * Each kind of bad file, through the real API, storage and database: the check step refuses
 * it with its own message, a commit is turned away, and not one row of data or audit is left.
 */

let refusals: TrialFixture;
let technician: TestClient;

const encode = (text: string) => new TextEncoder().encode(text);

async function startAndPut(client: TestClient, fixture: TrialFixture, content: string | Uint8Array, fileName = "density.csv") {
  const bytes = typeof content === "string" ? encode(content) : content;
  const started = await client.request("/api/uploads", {
    method: "POST",
    json: { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, fileName, sizeBytes: bytes.byteLength },
  });
  expect(started.status).toBe(201);
  const { uploadId, putUrl, contentType } = await started.json();
  const put = await fetch(putUrl, { method: "PUT", headers: { "content-type": contentType }, body: Buffer.from(bytes) });
  expect(put.status).toBe(200);
  return uploadId as string;
}

async function check(client: TestClient, uploadId: string) {
  const response = await client.request(`/api/uploads/${uploadId}/check`, { method: "POST" });
  return { status: response.status, body: await response.json() };
}

async function count(sql: string, replacements: Record<string, unknown>): Promise<number> {
  const [{ count }] = await testDatabase().query<{ count: number }>(sql, { replacements, type: QueryTypes.SELECT });
  return count;
}

/** Everything a commit would write for the fixture's assessment. */
async function writtenFor(fixture: TrialFixture) {
  const replacements = { trialId: fixture.trial.id, assessmentId: fixture.assessment.id };
  return {
    versions: await count("SELECT count(*)::int AS count FROM dataset_versions WHERE assessment_id = :assessmentId", replacements),
    valueRows: await count("SELECT count(*)::int AS count FROM observation_values v JOIN plots p ON p.id = v.plot_id WHERE p.trial_id = :trialId", replacements),
    auditEvents: await count("SELECT count(*)::int AS count FROM audit_events WHERE trial_id = :trialId AND entity_id = :assessmentId", replacements),
  };
}

const header = "plot,quadrat,value";
const utf16 = (text: string) => new Uint8Array([0xff, 0xfe, ...new Uint8Array(Buffer.from(text, "utf16le"))]);
const manyColumns = ["plot", "quadrat", "value", ...Array.from({ length: 58 }, (_, index) => `note${index + 1}`)].join(",");
// One row past the 200,000-row limit (about 1.8 MB, well inside the 20 MB size limit).
const tooManyRows = () => [header, ...Array.from({ length: 200_001 }, (_, index) => `${101 + (index % 3)},${1 + (index % 2)},3`)].join("\n");

const badFiles: [string, () => string | Uint8Array, string][] = [
  ["a duplicate plot and quadrat", () => `${header}\n101,1,3\n101,1,4\n`, "Row 3: plot 101, quadrat 1 already has a value in row 2. Keep one of them."],
  ["a negative value", () => `${header}\n101,1,-3\n`, "Row 2: -3 for plot 101, quadrat 1 is negative; counts, weights and ratings cannot be."],
  ["a wrong unit in the header", () => "plot,quadrat,value (g)\n101,1,3\n", "The values are in g, but this assessment records plants per quadrat. Convert them or check that this is the right assessment."],
  ["a wrong unit in a unit column", () => "plot,quadrat,value,unit\n101,1,3,g/m²\n", "Row 2: the value is in g/m², but this assessment records plants per quadrat."],
  ["a quadrat the assessment does not have", () => `${header}\n101,1,3\n101,3,4\n`, 'Row 3: quadrat "3" is not between 1 and 2.'],
  ["a quadrat column the assessment does not have", () => "plot,q1,q2,q3\n101,1,2,3\n", 'Column "q3" is quadrat 3, but this assessment has 2 quadrats per plot.'],
  ["binary data", () => new Uint8Array([0x70, 0x6c, 0x6f, 0x74, 0x00, 0x01, 0x02, 0x03]), "The file contains binary data, so it is not a CSV file. Upload the CSV export of the data sheet."],
  ["UTF-16 text", () => utf16(`${header}\n101,1,3\n`), 'The file is saved as UTF-16 text. Save it as "CSV UTF-8 (comma-separated)" and upload it again.'],
  ["a PDF", () => encode("%PDF-1.7\n1 0 obj << /Type /Catalog >> endobj\n"), 'This file is a PDF document, not a CSV file. In your spreadsheet, choose "Save as" → "CSV (comma-separated)" and upload that.'],
  ["tabs as delimiter", () => "plot\tquadrat\tvalue\n101\t1\t3\n", 'The columns are separated by tabs, not commas. Save the file as "CSV (comma-separated)" and upload it again.'],
  ["no value column", () => "plot,quadrat,species\n101,1,pigweed\n", 'The header has no "value" column (or q1, q2, … columns for one column per quadrat).'],
  ["too many columns", () => `${manyColumns}\n101,1,3\n`, "The header has 61 columns; a data file has at most 60. Use the data sheet template."],
  ["too many rows", tooManyRows, "The file has more than 200,000 rows, the most one upload may hold. Split it by assessment date."],
  ["two value columns", () => "plot,quadrat,value,count\n101,1,3,4\n", 'There are two "value" columns; keep one.'],
  ["a row with more cells than the header", () => `${header}\n101,1,3\n101,2,3,5\n`, "Row 3 has 4 cells but the header has 3. A value like 12,5 with a comma as decimal mark splits a cell: use 12.5."],
];

beforeAll(async () => {
  refusals = await createTrialFixture();
  const technicianUser = await User.findOne({ where: { email: "technician@hoebench.test" } });
  await Membership.create({ trialId: refusals.trial.id, userId: technicianUser!.id, role: "technician" });
  technician = await signedInAs("technician@hoebench.test");
});

afterAll(async () => {
  await removeTrialFixtures();
  await testDatabase().close();
});

describe("bad files are refused with their message and write nothing", () => {
  for (const [name, content, message] of badFiles) {
    it(`refuses ${name}`, async () => {
      const uploadId = await startAndPut(technician, refusals, content());
      const checked = await check(technician, uploadId);
      expect(checked.status).toBe(200);
      expect(checked.body.status).toBe("refused");
      const errors = checked.body.problems.filter((problem: { severity: string }) => problem.severity === "error");
      expect(errors.map((problem: { message: string }) => problem.message)).toEqual([message]);
      expect(checked.body.errors).toBe(1);

      const commit = await technician.request(`/api/uploads/${uploadId}/commit`, { method: "POST", json: {} });
      expect(commit.status).toBe(409);
      expect((await commit.json()).error.message).toBe("Check the file and fix its errors before committing it.");

      expect((await Upload.findByPk(uploadId))?.status).toBe("refused");
      expect((await Upload.findByPk(uploadId))?.versionId).toBeNull();
      expect(await writtenFor(refusals)).toEqual({ versions: 0, valueRows: 0, auditEvents: 0 });
    });
  }

  it("warns about a column it does not know, without refusing the file", async () => {
    const file = ["plot,quadrat,value,observer", ...refusals.plots.flatMap((plot) => [1, 2].map((quadrat) => `${plot.number},${quadrat},3,initials`))].join("\n");
    const checked = await check(technician, await startAndPut(technician, refusals, file));
    expect(checked.body.status).toBe("checked");
    expect(checked.body.problems).toEqual([{ severity: "warning", code: "extra-column", row: 1, column: "observer", message: 'The column "observer" is not used; its values are ignored.' }]);
    expect(await writtenFor(refusals)).toEqual({ versions: 0, valueRows: 0, auditEvents: 0 });
  });
});

describe("two uploads to the same assessment at once", () => {
  it("become versions N and N+1, and the values in place are all the later one's", async () => {
    const fixture = await createTrialFixture();
    const technicianUser = await User.findOne({ where: { email: "technician@hoebench.test" } });
    await Membership.create({ trialId: fixture.trial.id, userId: technicianUser!.id, role: "technician" });
    const file = (base: number) => ["plot,quadrat,value", ...fixture.plots.flatMap((plot) => [1, 2].map((quadrat) => `${plot.number},${quadrat},${base + quadrat}`))].join("\n");

    const first = await startAndPut(technician, fixture, file(0), "first.csv");
    expect((await check(technician, first)).body.status).toBe("checked");
    expect((await technician.request(`/api/uploads/${first}/commit`, { method: "POST", json: {} })).status).toBe(201);

    for (const round of [0, 1]) {
      const bases = [10 + round * 100, 50 + round * 100];
      const uploadIds = [await startAndPut(technician, fixture, file(bases[0]), "a.csv"), await startAndPut(technician, fixture, file(bases[1]), "b.csv")];
      const checks = await Promise.all(uploadIds.map((uploadId) => check(technician, uploadId)));
      expect(checks.map((checked) => checked.body.status)).toEqual(["checked", "checked"]);

      const commits = await Promise.all(uploadIds.map((uploadId) => technician.request(`/api/uploads/${uploadId}/commit`, { method: "POST", json: {} })));
      expect(commits.map((response) => response.status)).toEqual([201, 201]);
      const numbers = (await Promise.all(commits.map((response) => response.json()))).map((body: { number: number }) => body.number);
      const n = 2 + round * 2;
      expect([...numbers].sort((a, b) => a - b)).toEqual([n, n + 1]);

      const later = numbers.indexOf(n + 1);
      const earlier = 1 - later;
      const current = await testDatabase().query<{ plotNumber: number; quadrat: number; value: number; version: number }>(
        `SELECT p.number AS "plotNumber", o.quadrat, o.value, v.number AS version
           FROM current_observations o JOIN plots p ON p.id = o.plot_id JOIN dataset_versions v ON v.id = o.added_in_version_id
          WHERE o.assessment_id = :assessmentId ORDER BY p.number, o.quadrat`,
        { replacements: { assessmentId: fixture.assessment.id }, type: QueryTypes.SELECT },
      );
      expect(current).toEqual(fixture.plots.flatMap((plot) => [1, 2].map((quadrat) => ({ plotNumber: plot.number, quadrat, value: bases[later] + quadrat, version: n + 1 }))));

      // The earlier of the two is kept whole as version N, replaced in full by N+1.
      const earlierValues = await testDatabase().query<{ value: number; replacedIn: number }>(
        `SELECT o.value, r.number AS "replacedIn" FROM observations o
           JOIN dataset_versions a ON a.id = o.added_in_version_id JOIN dataset_versions r ON r.id = o.replaced_in_version_id
          WHERE o.assessment_id = :assessmentId AND a.number = :n`,
        { replacements: { assessmentId: fixture.assessment.id, n }, type: QueryTypes.SELECT },
      );
      expect(earlierValues).toHaveLength(24);
      expect(new Set(earlierValues.map((row) => row.value - bases[earlier]))).toEqual(new Set([1, 2]));
      expect(new Set(earlierValues.map((row) => row.replacedIn))).toEqual(new Set([n + 1]));

      const stored = await Promise.all(uploadIds.map((uploadId) => Upload.findByPk(uploadId)));
      expect(stored.map((upload) => upload?.status)).toEqual(["committed", "committed"]);
    }
    const audit = await testDatabase().query<{ version: number }>(
      `SELECT (new_value->>'version')::int AS version FROM audit_events WHERE entity_type = 'assessment-data' AND entity_id = :assessmentId ORDER BY version`,
      { replacements: { assessmentId: fixture.assessment.id }, type: QueryTypes.SELECT },
    );
    expect(audit.map((row) => row.version)).toEqual([1, 2, 3, 4, 5]);
  });
});

describe("another trial's upload", () => {
  it("cannot be checked or committed by a technician outside that trial", async () => {
    const other = await createTrialFixture({ ownerEmail: "researcher2@hoebench.test" });
    const owner = await signedInAs("researcher2@hoebench.test");
    const file = ["plot,quadrat,value", ...other.plots.flatMap((plot) => [1, 2].map((quadrat) => `${plot.number},${quadrat},4`))].join("\n");
    const uploadId = await startAndPut(owner, other, file);
    expect((await check(owner, uploadId)).body.status).toBe("checked");

    const checkAttempt = await technician.request(`/api/uploads/${uploadId}/check`, { method: "POST" });
    expect(checkAttempt.status).toBe(404);
    const commitAttempt = await technician.request(`/api/uploads/${uploadId}/commit`, { method: "POST", json: {} });
    expect(commitAttempt.status).toBe(404);

    expect((await Upload.findByPk(uploadId))?.status).toBe("checked");
    expect(await writtenFor(other)).toEqual({ versions: 0, valueRows: 0, auditEvents: 0 });
  });
});
