import { signIn } from "./support/session";
import { expect, test, type Page } from "@playwright/test";

const PASSWORD = "hoebench-demo";


async function openResults(page: Page) {
  await page.goto("/trials");
  await page.getByRole("link", { name: "Lettuce weed control: mulches, flame, cultivation and a solar weeding robot", exact: true }).click();
  await page.getByRole("navigation", { name: "Trial sections" }).getByRole("link", { name: "Results" }).click();
  await expect(page.getByTestId("results-list")).toBeVisible();
}

test("a researcher reads an assessment's tables, letters and charts and changes the options", async ({ page }) => {
  test.setTimeout(120_000);
  await signIn(page, "researcher@hoebench.test");
  await openResults(page);
  // The course over the season is drawn by plotly, offline.
  await expect(page.locator(".js-plotly-plot").first()).toBeVisible({ timeout: 30_000 });
  await page.getByRole("link", { name: "Weed density, 28 days after planting" }).click();
  await expect(page.getByTestId("anova-table")).toBeVisible();
  await expect(page.getByTestId("warnings")).toContainText("lost plots");
  await expect(page.getByTestId("letters-note")).toContainText("Fisher's protected LSD at α = 0.05");
  await expect(page.locator(".js-plotly-plot")).toHaveCount(4, { timeout: 30_000 });
  await expect(page.locator(".js-plotly-plot .main-svg").first()).toBeVisible();
  await page.screenshot({ path: "test-results/results-desktop.png", fullPage: true });

  await page.getByLabel("Mean separation").selectOption("tukey");
  await expect(page.getByTestId("letters-note")).toContainText("Tukey's HSD");
  await page.getByLabel("Transform").selectOption("sqrt");
  await expect(page.getByTestId("means-table")).toContainText("Transformed mean");
  await expect(page.getByTestId("means-table")).toContainText("% control (vs WC)");
  await page.getByLabel("Equivalence reference").selectOption("HH");
  await page.getByLabel("Margin (±)").fill("1.5");
  await expect(page.getByTestId("equivalence")).toContainText("90% interval");
  await page.getByRole("button", { name: /^Mean/ }).click();
  await page.screenshot({ path: "test-results/results-options.png", fullPage: true });

  await page.setViewportSize({ width: 390, height: 844 });
  await page.reload();
  await expect(page.getByTestId("anova-table")).toBeVisible();
  // The options live in the address, so the reload shows the same analysis.
  await expect(page).toHaveURL(/method=tukey.*reference=HH&margin=1\.5/);
  await expect(page.getByLabel("Mean separation")).toHaveValue("tukey");
  await expect(page.getByRole("combobox", { name: /^Transform/ })).toHaveValue("sqrt");
  await expect(page.getByTestId("equivalence")).toContainText("90% interval");
  await expect(page.locator(".js-plotly-plot").first()).toBeVisible({ timeout: 30_000 });
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  expect(overflow).toBeLessThanOrEqual(1);
  await page.screenshot({ path: "test-results/results-phone.png", fullPage: true });
});

test("a grower cannot open a trial's results", async ({ page }) => {
  await signIn(page, "researcher@hoebench.test");
  await openResults(page);
  const url = page.url();
  await page.context().clearCookies();
  await signIn(page, "grower@hoebench.test");
  const response = await page.goto(url);
  expect(response?.status()).toBe(404);
});

test("the lettuce protocol at two sites is analysed combined, with the site × treatment test", async ({ page }) => {
  await signIn(page, "researcher@hoebench.test");
  await page.goto("/combined");
  await page.getByRole("link", { name: "Weed density, 42 days after planting" }).click();
  await expect(page.getByTestId("site-by-treatment")).toContainText("Site × treatment: F =");
  await expect(page.getByTestId("anova-table")).toContainText("Site × treatment");
  await page.screenshot({ path: "test-results/combined.png", fullPage: true });
});
