import { expect, test } from "@playwright/test";
import { randomUUID } from "node:crypto";
import { createTrialFixture, removeTrialFixtures, type TrialFixture } from "../factories/trials";
import { testDatabase } from "../support/database";
import { writeRawValues } from "@/lib/observations/write-raw-values";

let fixture: TrialFixture;

test.beforeAll(async () => {
  fixture = await createTrialFixture({ status: "active", treatments: 3, blocks: 4 });
  const counts: Record<number, number[]> = { 1: [40, 48, 44, 52], 2: [4, 6, 5, 3], 3: [20, 26, 18, 30] };
  const values = fixture.plots.flatMap((plot) => [1, 2].map((quadrat) => ({ plotNumber: plot.number, quadrat, species: "all", value: counts[plot.position][plot.block - 1] })));
  // Straight into the tables: see writeRawValues.
  const sequelize = testDatabase();
  const versionId = randomUUID();
  await sequelize.query(
    `INSERT INTO dataset_versions (id, assessment_id, trial_id, number, source, created_by_id, rows_added, rows_replaced, created_at)
     VALUES (:versionId, :assessmentId, :trialId, 1, 'manual', :userId, :rows, 0, now())`,
    { replacements: { versionId, assessmentId: fixture.assessment.id, trialId: fixture.trial.id, userId: fixture.owner.id, rows: values.length } },
  );
  const plotIds = new Map(fixture.plots.map((plot) => [plot.number, plot.id]));
  await writeRawValues(sequelize, versionId, values.map((value) => ({ plotId: plotIds.get(value.plotNumber)!, quadrat: value.quadrat, species: value.species, value: value.value })));
  await fixture.trial.update({ status: "locked" });
});

// The connection stays open: browser specs share one worker process and its database connection.
test.afterAll(removeTrialFixtures);

test("a researcher edits the generated summary of a locked trial and publishes it; visitors read the edited text", async ({ page }) => {
  const url = `/library/${fixture.trial.id}`;
  expect((await page.request.get(url)).status()).toBe(404);

  await page.goto("/signin");
  await page.getByLabel("E-mail").fill("researcher@hoebench.test");
  await page.getByLabel("Password").fill("hoebench-demo");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page).not.toHaveURL(/signin/);
  await page.goto(`/trials/${fixture.trial.id}`);
  await page.getByRole("navigation", { name: "Trial sections" }).getByRole("link", { name: "Summary" }).click();
  const editor = page.getByLabel("Summary text");
  await expect(editor).toHaveValue(/reduced weeds by about/);
  await editor.fill(`${await editor.inputValue()}\n\nNote from the researcher: plots were hand-watered in a dry June.`);
  await expect(page.getByTestId("summary-text")).toContainText("hand-watered in a dry June");
  await page.getByRole("button", { name: "Save text" }).click();
  await expect(page.getByRole("status").filter({ hasText: "Saved." })).toBeVisible();
  await page.screenshot({ path: "test-results/summary-edit.png", fullPage: true });

  await page.getByRole("button", { name: "Publish to the library" }).click();
  await page.screenshot({ path: "test-results/summary-publish-confirm.png", fullPage: true });
  await page.getByRole("button", { name: "Publish now" }).click();
  // The editor's refresh swaps it for the page's published notice; wait for that, the settled state.
  await expect(page.getByRole("status").filter({ hasText: /Published on \d{4}-\d{2}-\d{2}\. Growers can read it in the library now/ })).toBeVisible();
  await expect(page.getByLabel("Summary text")).toHaveCount(0);
  await page.screenshot({ path: "test-results/summary-published.png", fullPage: true });

  await page.context().clearCookies();
  await page.goto(url);
  await expect(page.getByTestId("summary-text")).toContainText("hand-watered in a dry June");
  await expect(page.getByText("The researcher edited the generated text")).toBeVisible();
});
