import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { summaryNumbersOf, summaryOf } from "@/lib/data/summaries";
import { generateSummary } from "@/lib/summaries/generate";
import type { SummaryNumbers } from "@/lib/summaries/numbers";
import { AuditEvent, Trial, TrialSummary, User } from "@/models";
import { testDatabase } from "../support/database";

// The lib functions reach the database through db(); point it at the test connection.
const globalForDb = globalThis as unknown as { hoebenchSequelize?: unknown };
let onion: Trial;

beforeAll(async () => {
  globalForDb.hoebenchSequelize = testDatabase();
  onion = (await Trial.findOne({ where: { status: "published", crop: "Onion" } }))!;
});

afterAll(async () => {
  delete globalForDb.hoebenchSequelize;
  await testDatabase().close();
});

// `npm test` seeds its database with the demo, so this checks what the seed left.
describe("the demo's published trial", () => {
  it("was published through the app's path: a stored summary, its numbers, date, publisher and audit entry", async () => {
    const record = (await TrialSummary.findOne({ where: { trialId: onion.id } }))!;
    expect(record).not.toBeNull();
    const researcher = (await User.findOne({ where: { email: "researcher@hoebench.test" } }))!;
    expect(record.publishedById).toBe(researcher.id);
    expect(record.publishedAt).toBeInstanceOf(Date);
    expect(record.publishedAt!.getTime()).toBeLessThanOrEqual(Date.now());
    expect(record.editedText).toBeNull();

    const numbers = record.numbers as SummaryNumbers;
    expect(numbers.input.methods.map((method) => method.code)).toEqual(["WC", "WF", "HH", "SM", "FC"]);
    expect(numbers.input.weeds!.checkCode).toBe("WC");
    expect(numbers.input.weeds!.results.map((result) => result.code)).toEqual(expect.arrayContaining(["HH", "SM", "FC"]));
    expect(record.generatedText).toBe(generateSummary(numbers.input).text);
    expect(record.publishedText).toBe(record.generatedText);

    // The snapshot is what the app computes from the trial's data now, apart from when it was made.
    const now = await summaryNumbersOf(onion);
    expect(JSON.parse(JSON.stringify({ ...now, generatedAt: "" }))).toEqual({ ...numbers, generatedAt: "" });

    const audit = await AuditEvent.findAll({ where: { trialId: onion.id, entityType: "trial", source: "demo seed" } });
    expect(audit.map((event) => [event.summary, event.newValue])).toEqual([["Published with its plain-language summary (generated text)", { status: "published" }]]);
  });

  it("reads back as the stored summary, not a fresh draft", async () => {
    const record = (await TrialSummary.findOne({ where: { trialId: onion.id } }))!;
    const view = await summaryOf(onion);
    expect(view.published?.at.getTime()).toBe(record.publishedAt!.getTime());
    expect(view.text).toBe(record.publishedText);
    expect(view.numbers.generatedAt).toBe((record.numbers as SummaryNumbers).generatedAt);
  });
});
