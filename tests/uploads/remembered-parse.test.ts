import { afterAll, beforeEach, describe, expect, it, vi } from "vitest";
import { DatasetVersion } from "@/models";
import { createTrialFixture, removeTrialFixtures, type TrialFixture } from "../factories/trials";
import { testDatabase } from "../support/database";

// The real storage module, with its one full read counted.
vi.mock("@/lib/storage/objects", async (importOriginal) => {
  const actual = await importOriginal<typeof import("@/lib/storage/objects")>();
  return { ...actual, openObject: vi.fn(actual.openObject) };
});

const { openObject } = await import("@/lib/storage/objects");
const { checkUpload, commitUpload, startUpload } = await import("@/lib/uploads/service");

/** A sheet of three quadrats per plot. */
function sheet(fixture: TrialFixture): string {
  return ["plot,quadrat,value", ...fixture.plots.flatMap((plot) => [1, 2, 3].map((quadrat) => `${plot.number},${quadrat},${quadrat + 1}`))].join("\n");
}

async function checkedUpload(fixture: TrialFixture) {
  const user = { id: fixture.owner.id, email: fixture.owner.email, name: fixture.owner.name, role: fixture.owner.role };
  const bytes = Buffer.from(sheet(fixture));
  const started = await startUpload(user, fixture.trial, { trialId: fixture.trial.id, assessmentId: fixture.assessment.id, fileName: "d.csv", sizeBytes: bytes.byteLength });
  const put = await fetch(started.putUrl, { method: "PUT", headers: { "content-type": started.contentType }, body: bytes });
  expect(put.status).toBe(200);
  const checked = await checkUpload(started.uploadId);
  expect(checked).toMatchObject({ status: "checked", errors: 0, rowCount: bytes.toString().split("\n").length - 1 });
  return { user, uploadId: started.uploadId };
}

beforeEach(() => {
  vi.mocked(openObject).mockClear();
});

describe("a commit right after its check", () => {
  it("commits the check's parse without reading the file again", async () => {
    const fixture = await createTrialFixture({ quadratsPerPlot: 3 });
    const { user, uploadId } = await checkedUpload(fixture);
    expect(openObject).toHaveBeenCalledTimes(1);
    const version = await commitUpload(user, uploadId);
    expect(version).toMatchObject({ number: 1, rowsAdded: fixture.plots.length * 3 });
    expect(openObject).toHaveBeenCalledTimes(1);
  });

  it("reads and checks the file again when the assessment's settings changed since the check, and commits it if it still passes", async () => {
    const fixture = await createTrialFixture({ quadratsPerPlot: 3 });
    const { user, uploadId } = await checkedUpload(fixture);
    await fixture.assessment.update({ plausibleMax: 400 });
    const version = await commitUpload(user, uploadId);
    expect(version.number).toBe(1);
    expect(openObject).toHaveBeenCalledTimes(2);
  });

  it("refuses the file when the assessment now has fewer quadrats than the file, and writes nothing", async () => {
    const fixture = await createTrialFixture({ quadratsPerPlot: 3 });
    const { user, uploadId } = await checkedUpload(fixture);
    await fixture.assessment.update({ quadratsPerPlot: 2 });
    await expect(commitUpload(user, uploadId)).rejects.toMatchObject({ code: "CONFLICT", message: "The file has errors; fix them and upload it again." });
    expect(await DatasetVersion.count({ where: { assessmentId: fixture.assessment.id } })).toBe(0);
  });
});

afterAll(async () => {
  await removeTrialFixtures();
  await testDatabase().close();
});
