import { describe, expect, it } from "vitest";
import { editRefusal, randomizeRefusal } from "@/lib/trials/edit-rules";
import { assessmentSchedule, dueDate } from "@/lib/trials/schedule";
import { activationReadiness, statusChangeRefusal } from "@/lib/trials/status";
import { trialBasicsSchema, trialDesignSchema, trialTreatmentsSchema } from "@/lib/validations/trial";

const none = { hasObservations: false };

describe("edit rules", () => {
  it("lets a draft change everything", () => {
    for (const part of ["details", "structure", "assessment", "team"] as const) expect(editRefusal(part, { status: "draft", ...none })).toBeNull();
    expect(randomizeRefusal("draft")).toBeNull();
  });

  it("refuses structure changes on an active trial with a plain reason, but not details or team", () => {
    expect(editRefusal("structure", { status: "active", ...none })).toMatch(/active: its treatments, design and plots are in the field/);
    expect(editRefusal("details", { status: "active", ...none })).toBeNull();
    expect(editRefusal("team", { status: "active", ...none })).toBeNull();
    expect(editRefusal("assessment", { status: "active", ...none })).toBeNull();
    expect(randomizeRefusal("active")).toMatch(/Only a draft trial can be re-randomized/);
  });

  it("pins what has observations", () => {
    expect(editRefusal("assessment", { status: "active", hasObservations: true })).toMatch(/Observations have been recorded for this assessment/);
    expect(editRefusal("structure", { status: "draft", hasObservations: true })).toMatch(/Observations have been recorded/);
  });

  it("makes locked and published trials read-only", () => {
    for (const part of ["details", "structure", "assessment", "team"] as const) {
      expect(editRefusal(part, { status: "locked", ...none })).toBe("This trial is locked after review and is read-only.");
      expect(editRefusal(part, { status: "published", ...none })).toBe("This trial is published and is read-only.");
    }
    expect(randomizeRefusal("locked")).toMatch(/read-only/);
  });
});

describe("activation", () => {
  const complete = { treatments: 3, hasWeedyCheck: true, plots: 12, assessments: 1 };

  it("needs two treatments, a layout and an assessment, and warns without a weedy check", () => {
    expect(activationReadiness(complete)).toEqual({ missing: [], warnings: [] });
    const empty = activationReadiness({ treatments: 1, hasWeedyCheck: false, plots: 0, assessments: 0 });
    expect(empty.missing).toEqual(["Add at least two treatments.", "Randomize the plot layout.", "Plan at least one assessment."]);
    expect(empty.warnings[0]).toMatch(/no weedy check/);
    expect(activationReadiness({ ...complete, hasWeedyCheck: false }).missing).toEqual([]);
  });

  it("allows only draft → active from the trial page", () => {
    const ready = activationReadiness(complete);
    expect(statusChangeRefusal("draft", "active", ready)).toBeNull();
    expect(statusChangeRefusal("draft", "active", activationReadiness({ ...complete, plots: 0 }))).toMatch(/Randomize the plot layout/);
    expect(statusChangeRefusal("active", "locked", ready)).toMatch(/reviewer's sign-off/);
    expect(statusChangeRefusal("draft", "published", ready)).toMatch(/cannot go from draft to published/);
    expect(statusChangeRefusal("published", "draft", ready)).toMatch(/cannot go from published to draft/);
  });
});

describe("assessment schedule", () => {
  const base = { plannedDate: null, timingDays: null, timingReference: null } as const;

  it("dates assessments from planting unless a date is planned, and sorts them with undated last", () => {
    const rows = assessmentSchedule(
      [
        { ...base, id: "c", name: "undated" },
        { ...base, id: "b", name: "28 DAP", timingDays: 28, timingReference: "planting" as const },
        { ...base, id: "a", name: "fixed", plannedDate: "2026-05-20" },
      ],
      "2026-05-12",
      "2026-05-26",
    );
    expect(rows.map((row) => [row.assessment.id, row.dueDate, row.daysFromToday, row.state])).toEqual([
      ["a", "2026-05-20", -6, "overdue"],
      ["b", "2026-06-09", 14, "upcoming"],
      ["c", null, null, "undated"],
    ]);
    expect(dueDate({ ...base, id: "x", name: "x", timingDays: 14, timingReference: "planting" }, "2026-12-25")).toBe("2027-01-08");
    expect(dueDate({ ...base, id: "x", name: "x", timingDays: 14, timingReference: "treatment" }, "2026-05-12")).toBeNull();
  });
});

describe("wizard schemas", () => {
  it("reports each basics field with its own message", () => {
    const result = trialBasicsSchema.safeParse({ title: "x", crop: "", season: "next year", siteId: "", objective: "", plantingDate: "12/05/2026" });
    expect(result.success).toBe(false);
    const messages = Object.fromEntries(result.error!.issues.map((issue) => [issue.path.join("."), issue.message]));
    expect(messages).toEqual({
      title: "Give the trial a title of at least 3 characters.",
      crop: "Name the crop.",
      season: "Enter the season as a year, such as 2026 (or 2026/27).",
      siteId: "Choose a site.",
      plantingDate: "Enter a date as YYYY-MM-DD.",
    });
  });

  it("takes form strings and JSON numbers alike", () => {
    const fromForm = trialDesignSchema.parse({ design: "rcbd", blocks: "4", plotLengthM: "6", plotWidthM: "1.5", harvestAreaM2: "4.5", quadratAreaM2: "0.25", serpentine: true, randomSeed: "42" });
    const fromJson = trialDesignSchema.parse({ design: "rcbd", blocks: 4, plotLengthM: 6, plotWidthM: 1.5, harvestAreaM2: 4.5, quadratAreaM2: 0.25, serpentine: true, randomSeed: 42 });
    expect(fromForm).toEqual(fromJson);
  });

  it("refuses a harvest area larger than the plot", () => {
    const result = trialDesignSchema.safeParse({ design: "rcbd", blocks: 4, plotLengthM: 2, plotWidthM: 1, harvestAreaM2: 3, quadratAreaM2: 0.25, serpentine: false, randomSeed: 1 });
    expect(result.error?.issues[0]).toMatchObject({ path: ["harvestAreaM2"], message: "The harvest area cannot be larger than the plot (2 m²)." });
  });

  it("finds duplicate codes, a second weedy check and a check without its kind", () => {
    const treatment = { code: "T1", name: "Hand hoeing", category: "hand", checkType: "", description: "", timing: "", rateOrSettings: "", labourHoursPerHa: "", materialCostPerHa: "" };
    const result = trialTreatmentsSchema.safeParse({
      treatments: [
        { ...treatment, code: "WC", name: "Weedy check", category: "check", checkType: "weedy" },
        { ...treatment, code: "wc", name: "Weedy again", category: "check", checkType: "weedy" },
        { ...treatment, code: "T3", category: "check" },
        { ...treatment, code: "T4", labourHoursPerHa: "-3" },
      ],
    });
    const paths = result.error!.issues.map((issue) => `${issue.path.join(".")}: ${issue.message}`);
    expect(paths).toEqual(
      expect.arrayContaining([
        "treatments.1.code: Code wc is already used by treatment 1.",
        "treatments.1.checkType: The trial already has a weedy check.",
        "treatments.2.checkType: Say whether this is the weedy or the weed-free check.",
        "treatments.3.labourHoursPerHa: Enter hours per hectare as a number, 0 or more.",
      ]),
    );
  });
});
