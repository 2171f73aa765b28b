import { signIn } from "./support/session";
import { expect, test, type Page } from "@playwright/test";

const PASSWORD = "hoebench-demo";


async function fillTreatment(page: Page, index: number, values: { code: string; name: string; method: string; check?: string }) {
  const row = page.getByTestId("treatment-row").nth(index);
  await row.getByLabel("Code").fill(values.code);
  await row.getByLabel("Name").fill(values.name);
  await row.getByLabel("Method").selectOption({ label: values.method });
  if (values.check) await row.getByLabel("Check", { exact: true }).selectOption({ label: values.check });
}

test("a researcher plans a new RCBD trial in the wizard and walks out with map, labels and data sheets", async ({ page }) => {
  test.setTimeout(180_000);
  const title = `Spinach weed control ${Date.now()}`;
  await signIn(page, "researcher@hoebench.test");
  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Trials", exact: true }).click();
  await expect(page.getByRole("heading", { name: "Trials", exact: true })).toBeVisible();
  await page.getByRole("link", { name: "New trial" }).click();

  // Basics: a validation message appears next to the field it belongs to.
  await page.getByLabel("Trial title").fill("x");
  await page.getByRole("button", { name: "Create draft and continue" }).click();
  const titleField = page.getByLabel("Trial title");
  await expect(titleField).toHaveAttribute("aria-invalid", "true");
  const titleError = page.locator(`[id="${await titleField.getAttribute("aria-describedby")}"]`);
  await expect(titleError).toHaveText("Give the trial a title of at least 3 characters.");
  await expect(page.getByText("Choose a site.")).toBeVisible();
  await page.screenshot({ path: "test-results/wizard-1-basics-errors.png", fullPage: true });

  await titleField.fill(title);
  await page.getByLabel("Crop").fill("Spinach");
  await page.getByLabel("Season").fill("2031");
  await page.getByRole("form", { name: "Trial basics" }).getByLabel("Site").selectOption({ index: 1 });
  await page.getByLabel("Planting date").fill("2031-04-15");
  await page.getByLabel("Objective").fill("Compare hand hoeing and flaming against a weedy check.");
  await page.getByRole("button", { name: "Create draft and continue" }).click();

  // Treatments: add, fill, reorder.
  await expect(page).toHaveURL(/\/plan\/treatments$/);
  await fillTreatment(page, 0, { code: "FL", name: "Flame weeding", method: "Thermal (flame, steam)" });
  await page.getByRole("button", { name: "+ Add a treatment" }).click();
  await fillTreatment(page, 1, { code: "WC", name: "Weedy check", method: "Check", check: "Weedy check (untreated)" });
  await page.getByRole("button", { name: "+ Add a treatment" }).click();
  await fillTreatment(page, 2, { code: "HH", name: "Hand hoeing", method: "Hand weeding" });
  await page.getByRole("button", { name: "Move treatment 2 up" }).click();
  await expect(page.getByTestId("treatment-row").first().getByLabel("Code")).toHaveValue("WC");
  await page.screenshot({ path: "test-results/wizard-2-treatments.png", fullPage: true });
  await page.getByRole("button", { name: "Save and continue" }).click();

  // Design: the planner answers, the layout is saved from the seed typed in.
  await expect(page).toHaveURL(/\/plan\/design$/);
  await expect(page.getByTestId("blocks-needed")).toContainText("blocks needed");
  await page.getByLabel("Number of blocks").fill("2");
  await expect(page.getByTestId("residual-df")).toContainText("Only 2 residual degrees of freedom");
  await page.getByLabel("Number of blocks").fill("4");
  await page.getByLabel("Random seed").fill("2031415");
  await page.screenshot({ path: "test-results/wizard-3-design.png", fullPage: true });
  await page.getByRole("button", { name: "Save, lay out plots and continue" }).click();

  // Assessments.
  await expect(page).toHaveURL(/\/plan\/assessments$/);
  await page.getByRole("button", { name: "+ Add" }).click();
  const assessment = page.getByTestId("assessment-row").first();
  await expect(assessment.getByLabel("Unit")).toHaveValue("plants per quadrat");
  await assessment.getByLabel("Days").fill("21");
  await page.screenshot({ path: "test-results/wizard-4-assessments.png", fullPage: true });
  await page.getByRole("button", { name: "Save and continue" }).click();

  // Team.
  await expect(page).toHaveURL(/\/plan\/team$/);
  await page.getByLabel("Add a technician or reviewer").selectOption({ label: "Tomas Brindlewood (technician)" });
  await page.getByRole("button", { name: "+ Add to team" }).click();
  await expect(page.getByTestId("team-row")).toHaveCount(1);
  await page.screenshot({ path: "test-results/wizard-5-team.png", fullPage: true });
  await page.getByRole("button", { name: "Save team and finish" }).click();

  // The trial page: plan, seed, map, cautions for flaming, schedule, team.
  await expect(page.getByRole("heading", { name: title })).toBeVisible();
  await expect(page.getByTestId("random-seed")).toHaveText("2031415");
  await expect(page.getByTestId("team-member")).toContainText("Tomas Brindlewood");
  await expect(page.getByRole("note", { name: "Safety" }).first()).toContainText("Fire risk");
  await expect(page.getByTestId("schedule-row")).toHaveCount(1);
  await expect(page.getByTestId("status-panel")).toContainText("The plan is complete");

  // Re-randomizing a draft is one click and stores the new seed.
  await page.getByRole("button", { name: "Re-randomize with a new seed" }).click();
  await expect(page.getByRole("status").filter({ hasText: "plots laid out" })).toBeVisible();
  await expect(page.getByTestId("random-seed")).not.toHaveText("2031415");
  await page.screenshot({ path: "test-results/trial-page.png", fullPage: true });

  await page.getByRole("link", { name: "Plot map", exact: true }).click();
  await expect(page.getByTestId("plot-map").locator("svg")).toBeVisible();
  await expect(page.getByText("Fire risk").first()).toBeVisible();
  const pdf = await page.request.get(await page.getByRole("link", { name: "Download PDF" }).getAttribute("href") as string);
  expect(pdf.headers()["content-type"]).toBe("application/pdf");
  await page.screenshot({ path: "test-results/plot-map.png", fullPage: true });

  await page.getByRole("link", { name: "Stake labels" }).click();
  await expect(page.getByTestId("stake-labels")).toContainText("101");
  await page.screenshot({ path: "test-results/stake-labels.png", fullPage: true });

  await page.getByRole("link", { name: "Data sheets" }).click();
  await page.getByTestId("sheet-row").first().getByRole("link").first().click();
  await expect(page.getByTestId("data-sheet")).toContainText("plants per quadrat");
  await page.screenshot({ path: "test-results/data-sheet.png", fullPage: true });

  // Start the trial; from then on the plan's structure is fixed.
  await page.getByRole("link", { name: "← All data sheets" }).click();
  await page.getByRole("link", { name: "Overview", exact: true }).click();
  page.once("dialog", (dialog) => dialog.accept());
  await page.getByRole("button", { name: "Start the trial (make it active)" }).click();
  await expect(page.getByText("Active: the layout is in the field")).toBeVisible();
  await page.goto(page.url() + "/plan/treatments");
  await expect(page.getByTestId("read-only-reason")).toHaveText("This trial is active: its treatments, design and plots are in the field and can no longer change.");
  await expect(page.getByRole("button", { name: "Save and continue" })).toBeDisabled();
});

test("the demo lettuce trial's map, labels and plot page render, also on a phone", async ({ page }) => {
  test.setTimeout(120_000);
  await signIn(page, "researcher@hoebench.test");
  await page.goto("/trials?crop=Lettuce&status=active");
  await expect(page.getByTestId("trial-row")).toHaveCount(2);
  await page.getByRole("link", { name: "Lettuce weed control: mulches, flame, cultivation and a solar weeding robot", exact: true }).click();
  await expect(page.getByTestId("treatment-item")).toHaveCount(8);
  await expect(page.getByTestId("random-seed")).toHaveText("20260512");
  await page.getByRole("link", { name: "Plot map", exact: true }).click();
  await expect(page.getByTestId("plot-map")).toBeVisible();
  await page.screenshot({ path: "test-results/lettuce-map.png", fullPage: true });
  await page.getByRole("link", { name: "Stake labels" }).click();
  await expect(page.getByTestId("stake-labels")).toContainText("408");
  await page.screenshot({ path: "test-results/lettuce-labels.png", fullPage: true });

  await page.setViewportSize({ width: 390, height: 844 });
  const trialUrl = page.url().replace(/\/labels$/, "");
  await page.goto(`${trialUrl}/plots/101`);
  await expect(page.getByRole("heading", { name: "Plot 101" })).toBeVisible();
  await expect(page.getByTestId("plot-block")).toHaveText("1");
  await page.screenshot({ path: "test-results/lettuce-plot-phone.png", fullPage: true });
  await page.goto(trialUrl);
  await page.screenshot({ path: "test-results/lettuce-trial-phone.png", fullPage: true });
});

test("a technician cannot reach the plan wizard, and a grower sees no trials list", async ({ page }) => {
  await signIn(page, "technician@hoebench.test");
  await page.goto("/trials/new");
  await expect(page.getByRole("heading", { name: "Not found" })).toBeVisible();
  await page.goto("/trials");
  await page.getByTestId("trial-row").first().getByRole("link").click();
  await expect(page.getByRole("link", { name: "Plan", exact: true })).toHaveCount(0);
  await expect(page.getByRole("button", { name: /randomize/i })).toHaveCount(0);
  await page.goto(page.url() + "/plan/design");
  await expect(page.getByRole("heading", { name: "Not found" })).toBeVisible();

  await page.context().clearCookies();
  await signIn(page, "grower@hoebench.test");
  await expect(page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Trials", exact: true })).toHaveCount(0);
  await page.goto("/trials");
  await expect(page.getByRole("heading", { name: "Not found" })).toBeVisible();
});
