import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import { DatasetVersion, Membership, Upload, User } from "@/models";
import { createTrialFixture, removeTrialFixtures, type TrialFixture } from "../factories/trials";
import { testDatabase } from "../support/database";
import { signedInAs, type TestClient } from "../support/http";

let fixture: TrialFixture;
let technician: TestClient;

function goodFile(value = 3): string {
  return ["plot,quadrat,species,value", ...fixture.plots.flatMap((plot) => [1, 2].map((quadrat) => `${plot.number},${quadrat},,${value + quadrat}`))].join("\n");
}

async function upload(client: TestClient, content: string | Uint8Array, fileName = "density.csv", target: TrialFixture = fixture) {
  const bytes = typeof content === "string" ? new TextEncoder().encode(content) : content;
  const started = await client.request("/api/uploads", {
    method: "POST",
    json: { trialId: target.trial.id, assessmentId: target.assessment.id, fileName, sizeBytes: bytes.byteLength },
  });
  if (started.status !== 201) return { started, check: null as Response | null, body: await started.json() };
  const { uploadId, putUrl, contentType } = await started.json();
  const put = await fetch(putUrl, { method: "PUT", headers: { "content-type": contentType }, body: Buffer.from(bytes) });
  expect(put.status).toBe(200);
  const check = await client.request(`/api/uploads/${uploadId}/check`, { method: "POST" });
  return { started, check, uploadId: uploadId as string, body: await check.json() };
}

async function currentValues(where: { assessmentId: string; plotId?: string }) {
  return testDatabase().query<{ quadrat: number; value: number }>(
    `SELECT quadrat, value FROM current_observations
      WHERE assessment_id = :assessmentId ${where.plotId ? "AND plot_id = :plotId" : ""} ORDER BY quadrat, species`,
    { replacements: { assessmentId: where.assessmentId, plotId: where.plotId ?? null }, type: QueryTypes.SELECT },
  );
}

beforeAll(async () => {
  fixture = await createTrialFixture();
  const technicianUser = await User.findOne({ where: { email: "technician@hoebench.test" } });
  await Membership.create({ trialId: fixture.trial.id, userId: technicianUser!.id, role: "technician" });
  technician = await signedInAs("technician@hoebench.test");
});

describe("uploading a data file", () => {
  it("goes to storage, is checked, previewed and committed as version 1", async () => {
    const { uploadId, body } = await upload(technician, goodFile());
    expect(body).toMatchObject({ status: "checked", format: "long", rowCount: 24, errors: 0, warnings: 0, changes: { added: 24, changed: 0, unchanged: 0, removed: 0 } });
    expect(body.preview[0]).toEqual({ row: 2, plotNumber: 101, quadrat: 1, species: "", value: 4 });
    const commit = await technician.request(`/api/uploads/${uploadId}/commit`, { method: "POST", json: {} });
    expect(commit.status).toBe(201);
    expect(await commit.json()).toMatchObject({ number: 1, rowsAdded: 24, rowsReplaced: 0 });
    expect(await currentValues({ assessmentId: fixture.assessment.id })).toHaveLength(24);
    const stored = await Upload.findByPk(uploadId);
    expect(stored?.status).toBe("committed");
    expect(stored?.sha256).toMatch(/^[0-9a-f]{64}$/);

    const again = await technician.request(`/api/uploads/${uploadId}/commit`, { method: "POST", json: {} });
    expect(again.status).toBe(409);
  });

  it("shows what a second file changes and keeps both versions", async () => {
    const file = goodFile().replace("\n101,1,,4\n", "\n101,1,,40\n");
    const { uploadId, body } = await upload(technician, file);
    expect(body.changes).toEqual({ added: 0, changed: 1, unchanged: 23, removed: 0 });
    expect(body.problems).toEqual([]);
    await technician.request(`/api/uploads/${uploadId}/commit`, { method: "POST", json: {} });
    const versions = await DatasetVersion.findAll({ where: { assessmentId: fixture.assessment.id }, order: [["number", "ASC"]] });
    expect(versions.map((version) => version.number)).toEqual([1, 2]);
  });

  it("counts changes by cell whatever the order of the rows", async () => {
    const [header, ...rows] = goodFile().replace("\n101,1,,4\n", "\n101,1,,40\n").split("\n");
    // Version 2 as it stands, upside down, one value changed back, one left out and one quadrat's species named.
    const reordered = [header, ...rows.reverse().filter((row) => row !== "101,2,,5").map((row) => row.replace("101,1,,40", "101,1,,4").replace("102,1,,4", "102,1,pigweed,4"))];
    const { body } = await upload(technician, reordered.join("\n"));
    expect(body.changes).toEqual({ added: 1, changed: 1, unchanged: 21, removed: 2 });
  });

  it("refuses to commit a file that was replaced in storage after its check, and writes nothing", async () => {
    const checkedFile = goodFile(3);
    const swapped = goodFile(5); // the same size, other values: the signed PUT allows it
    expect(swapped.length).toBe(checkedFile.length);
    const started = await technician.request("/api/uploads", {
      method: "POST",
      json: { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, fileName: "swap.csv", sizeBytes: checkedFile.length },
    });
    const { uploadId, putUrl, contentType } = await started.json();
    const put = (body: string) => fetch(putUrl, { method: "PUT", headers: { "content-type": contentType }, body });
    expect((await put(checkedFile)).status).toBe(200);
    expect((await (await technician.request(`/api/uploads/${uploadId}/check`, { method: "POST" })).json()).status).toBe("checked");
    expect((await put(swapped)).status).toBe(200);
    const versionsBefore = await DatasetVersion.count({ where: { assessmentId: fixture.assessment.id } });

    const commit = await technician.request(`/api/uploads/${uploadId}/commit`, { method: "POST", json: {} });
    expect(commit.status).toBe(409);
    expect((await commit.json()).error.message).toBe("The stored file changed after it was checked. Check it again.");
    expect(await DatasetVersion.count({ where: { assessmentId: fixture.assessment.id } })).toBe(versionsBefore);
    expect((await Upload.findByPk(uploadId))?.status).toBe("checked");
  });

  const badFiles: [string, string | Uint8Array, string][] = [
    ["an empty file", "", "The file is empty"],
    ["a workbook", new Uint8Array([0x50, 0x4b, 0x03, 0x04, 9, 9, 9, 9]), "not a CSV file"],
    ["semicolons", "plot;quadrat;value\n101;1;3\n", "separated by semicolons"],
    ["Latin-1 bytes", new Uint8Array([...new TextEncoder().encode("plot,quadrat,species,value\n101,1,"), 0xe9, ...new TextEncoder().encode(",3\n")]), "not UTF-8"],
    ["an unknown plot", "plot,quadrat,value\n999,1,3\n", "plot 999 is not in this trial"],
    ["text in a value", "plot,quadrat,value\n101,1,lots\n", '"lots" for plot 101, quadrat 1 is not a number'],
  ];
  for (const [name, content, message] of badFiles) {
    it(`refuses ${name} with a clear message and writes nothing`, async () => {
      const before = await DatasetVersion.count({ where: { assessmentId: fixture.assessment.id } });
      const { uploadId, body } = await upload(technician, content);
      if (body.error) {
        expect(body.error.fields?.[0]?.message ?? body.error.message).toContain(message);
      } else {
        expect(body.status).toBe("refused");
        expect(body.problems.map((problem: { message: string }) => problem.message).join(" ")).toContain(message);
        const commit = await technician.request(`/api/uploads/${uploadId}/commit`, { method: "POST", json: {} });
        expect(commit.status).toBe(409);
      }
      expect(await DatasetVersion.count({ where: { assessmentId: fixture.assessment.id } })).toBe(before);
    });
  }

  it("checks a large file on two threads with the same result, and commits every value", async () => {
    const large = await createTrialFixture({ quadratsPerPlot: 40 });
    const technicianUser = await User.findOne({ where: { email: "technician@hoebench.test" } });
    await Membership.create({ trialId: large.trial.id, userId: technicianUser!.id, role: "technician" });
    const species = Array.from({ length: 36 }, (_, index) => `weed ${index + 1}`);
    const lines = ["plot,quadrat,species,value"];
    for (const plot of large.plots) for (let quadrat = 1; quadrat <= 40; quadrat += 1) for (const name of species) lines.push(`${plot.number},${quadrat},${name},${(plot.number + quadrat) % 9}`);
    // Two faults: one in each half of the file (a row moved to the end repeats one near the top).
    const eleventh = lines[10];
    lines[10] = eleventh.replace(/,\d+$/, ",lots");
    lines.push(lines[2]);
    const file = `${lines.join("\n")}\n`;
    expect(Buffer.byteLength(file)).toBeGreaterThan(256 * 1024);
    const { body } = await upload(technician, file, "large.csv", large);
    expect(body).toMatchObject({ status: "refused", rowCount: lines.length - 1, errors: 2, warnings: 0 });
    expect(body.problems.map((problem: { message: string }) => problem.message)).toEqual([
      'Row 11: "lots" for plot 101, quadrat 1, weed 10 is not a number.',
      `Row ${lines.length}: plot 101, quadrat 1, weed 2 already has a value in row 3. Keep one of them.`,
    ]);
    const health = await (await fetch(new URL("/api/health", technician.baseUrl))).json();
    expect(health.fileCheckThread).toBe("running");

    lines[10] = eleventh;
    lines.pop();
    const fixed = await upload(technician, `${lines.join("\n")}\n`, "large.csv", large);
    expect(fixed.body).toMatchObject({ status: "checked", rowCount: large.plots.length * 40 * 36, errors: 0, warnings: 0 });
    const commit = await technician.request(`/api/uploads/${fixed.uploadId}/commit`, { method: "POST", json: {} });
    expect(await commit.json()).toMatchObject({ number: 1, rowsAdded: large.plots.length * 40 * 36 });
    const [{ total }] = await testDatabase().query<{ total: number }>("SELECT sum(value)::int AS total FROM current_observations WHERE assessment_id = :assessmentId", {
      replacements: { assessmentId: large.assessment.id },
      type: QueryTypes.SELECT,
    });
    expect(total).toBe(large.plots.reduce((sum, plot) => sum + Array.from({ length: 40 }, (_, index) => (plot.number + index + 1) % 9).reduce((a, b) => a + b, 0) * 36, 0));
  });

  it("refuses a file over the size limit before anything is stored", async () => {
    const response = await technician.request("/api/uploads", {
      method: "POST",
      json: { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, fileName: "huge.csv", sizeBytes: 1024 * 1024 * 1024 },
    });
    expect(response.status).toBe(422);
    expect((await response.json()).error.fields[0].message).toBe("The file is larger than 20 MB, the most one upload may be.");
  });

  it("keeps technicians of other trials and growers out", async () => {
    const other = await createTrialFixture({ ownerEmail: "researcher2@hoebench.test" });
    const response = await technician.request("/api/uploads", {
      method: "POST",
      json: { trialId: other.trial.id, assessmentId: other.assessment.id, fileName: "x.csv", sizeBytes: 10 },
    });
    expect(response.status).toBe(404);
    const grower = await signedInAs("grower@hoebench.test");
    const growerAttempt = await grower.request("/api/uploads", {
      method: "POST",
      json: { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, fileName: "x.csv", sizeBytes: 10 },
    });
    expect(growerAttempt.status).toBe(404);
  });
});

describe("per-plot entry", () => {
  it("replaces one plot's values as a new version", async () => {
    const response = await technician.request("/api/plot-entries", {
      method: "POST",
      json: { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, plotNumber: 203, values: [{ quadrat: 1, value: 12 }, { quadrat: 2, value: null }] },
    });
    expect(response.status).toBe(201);
    const body = await response.json();
    expect(body).toMatchObject({ rowsAdded: 1, rowsReplaced: 2 });
    const current = await currentValues({ assessmentId: fixture.assessment.id, plotId: fixture.plots.find((plot) => plot.number === 203)!.id });
    expect(current.map((row) => [row.quadrat, row.value])).toEqual([[1, 12]]);
  });

  it("refuses a negative value and a quadrat the assessment does not have", async () => {
    const negative = await technician.request("/api/plot-entries", {
      method: "POST",
      json: { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, plotNumber: 101, values: [{ quadrat: 1, value: -1 }] },
    });
    expect(negative.status).toBe(422);
    expect((await negative.json()).error.fields[0].message).toBe("Counts, weights and ratings cannot be negative.");
    const extra = await technician.request("/api/plot-entries", {
      method: "POST",
      json: { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, plotNumber: 101, values: [{ quadrat: 3, value: 1 }] },
    });
    expect(extra.status).toBe(422);
    expect((await extra.json()).error.message).toBe("This assessment has 2 quadrats per plot; there is no quadrat 3.");
  });
});

describe("exports", () => {
  it("gives tidy raw values with formula-looking text neutralised", async () => {
    await technician.request("/api/plot-entries", {
      method: "POST",
      json: { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, plotNumber: 102, values: [{ quadrat: 1, species: "=cmd()", value: 2 }] },
    });
    const response = await technician.request(`/api/exports?trialId=${fixture.trial.id}&assessmentId=${fixture.assessment.id}&kind=raw`);
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    const text = await response.text();
    expect(text.split("\r\n")[0]).toBe("trial,assessment,plot,block,treatment_code,treatment,quadrat,species,value,unit,version");
    expect(text).toContain(",'=cmd(),2,");
    const plotValues = await technician.request(`/api/exports?trialId=${fixture.trial.id}&kind=plot`);
    const lines = (await plotValues.text()).split("\r\n");
    // Plot 203 now has quadrat 1 only: 12 plants per 0.25 m² quadrat = 48 plants/m².
    expect(lines.find((line) => line.includes(",203,"))).toMatch(/,203,2,T3,Method 3,1,12,plants per quadrat,48,plants\/m²$/);
  });
});

describe("photos", () => {
  it("stores a photo whose bytes are the image type it claims, and discards one that is not", async () => {
    const jpeg = new Uint8Array([0xff, 0xd8, 0xff, 0xe0, ...new Array(60).fill(7)]);
    const start = async (bytes: Uint8Array, contentType: string) => {
      const response = await technician.request("/api/photos", {
        method: "POST",
        json: { trialId: fixture.trial.id, plotNumber: 101, assessmentId: null, contentType, sizeBytes: bytes.byteLength, thumbnailBytes: jpeg.byteLength, caption: "Pigweed patch" },
      });
      expect(response.status).toBe(201);
      const { photoId, putUrl, thumbnailPutUrl } = await response.json();
      await fetch(putUrl, { method: "PUT", headers: { "content-type": contentType }, body: Buffer.from(bytes) });
      await fetch(thumbnailPutUrl, { method: "PUT", headers: { "content-type": "image/jpeg" }, body: Buffer.from(jpeg) });
      return { photoId, confirm: await technician.request(`/api/photos/${photoId}/confirm`, { method: "POST" }) };
    };
    const good = await start(jpeg, "image/jpeg");
    expect(good.confirm.status).toBe(200);
    const thumbnail = await technician.request(`/api/photos/${good.photoId}/thumbnail`);
    expect(thumbnail.headers.get("content-type")).toBe("image/jpeg");
    expect(new Uint8Array(await thumbnail.arrayBuffer())).toEqual(jpeg);

    const fake = await start(new TextEncoder().encode("<script>alert(1)</script>"), "image/png");
    expect(fake.confirm.status).toBe(422);
    expect((await fake.confirm.json()).error.message).toBe("That file is not the image it claimed to be; it was discarded.");
    expect((await technician.request(`/api/photos/${fake.photoId}/original`)).status).toBe(404);
  });
});

afterAll(async () => {
  await removeTrialFixtures();
  await testDatabase().close();
});
