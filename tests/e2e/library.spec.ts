import { signIn } from "./support/session";
import { readFileSync } from "node:fs";
import { expect, test, type Page } from "@playwright/test";

const PASSWORD = "hoebench-demo";
const ONION = "Onion weed control: hand hoeing, straw mulch and finger cultivation";


test("a signed-out visitor searches the library, reads the onion summary with costs per acre, and downloads its data", async ({ page }) => {
  await page.context().clearCookies();
  await page.goto("/library");
  await expect(page.getByRole("heading", { name: "Library of published trials" })).toBeVisible();
  await expect(page.getByRole("link", { name: "Sign in" })).toBeVisible();
  await page.getByLabel("Search", { exact: true }).fill("onion");
  await page.getByLabel("Method").selectOption({ label: "Cultivation" });
  await page.getByRole("button", { name: "Search" }).click();
  await expect(page).toHaveURL(/q=onion/);
  await expect(page.getByTestId("library-entry")).toHaveCount(1);
  await page.screenshot({ path: "test-results/library-search.png", fullPage: true });

  await page.getByRole("link", { name: ONION }).click();
  await expect(page.getByRole("heading", { name: ONION })).toBeVisible();
  const summary = page.getByTestId("summary-text");
  await expect(summary).toContainText("This is one trial at one site");
  await expect(summary).toContainText("compared with no weeding");
  await expect(summary).toContainText("per acre");
  await expect(page.getByRole("note", { name: /Safety: Finger cultivation/ })).toContainText("local regulations govern");

  // Costs per acre by default; the reader's labour rate changes them; metric on request.
  const table = page.getByTestId("cost-table");
  await expect(table).toContainText("Cost per acre");
  const hoeing = table.getByRole("row", { name: /Hand hoeing/ });
  const before = await hoeing.textContent();
  await page.getByLabel(/Labour \(\$ per hour\)/).fill("25");
  await expect(hoeing).not.toHaveText(before ?? "");
  await expect(page.getByTestId("weeds-chart")).toContainText("plants/ft²");
  await page.screenshot({ path: "test-results/library-summary-desktop.png", fullPage: true });
  await page.getByLabel("Hectares, kilograms").check();
  await expect(table).toContainText("Cost per hectare");
  await expect(page.getByTestId("weeds-chart")).toContainText("plants/m²");

  const [download] = await Promise.all([page.waitForEvent("download"), page.getByRole("link", { name: "Download the plot data (CSV)" }).click()]);
  const csv = readFileSync((await download.path())!, "utf8");
  expect(csv.split("\n")[0]).toContain("treatment_code");
  expect(csv).toContain(ONION);

  await page.setViewportSize({ width: 390, height: 844 });
  await page.getByLabel("Acres, pounds").check();
  await page.screenshot({ path: "test-results/library-summary-phone.png", fullPage: true });
});

test("an unpublished trial's library address is not found, for visitors and for its own researcher", async ({ page }) => {
  await signIn(page, "researcher2@hoebench.test");
  await page.goto("/trials");
  await page.getByRole("link", { name: "Carrot pre-emergence flaming timing" }).click();
  await page.waitForURL(/\/trials\/[0-9a-f-]{36}/);
  const trialId = page.url().split("/trials/")[1].split(/[/?#]/)[0];
  for (const signedIn of [true, false]) {
    if (!signedIn) await page.context().clearCookies();
    const response = await page.goto(`/library/${trialId}`);
    expect(response?.status()).toBe(404);
    await expect(page.getByRole("heading", { name: "Not found" })).toBeVisible();
    expect((await page.request.get(`/api/library/${trialId}/data`)).status()).toBe(404);
  }
});

test("a grower finds the library in the navigation and follows onions", async ({ page }) => {
  await signIn(page, "grower@hoebench.test");
  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Library" }).click();
  await page.getByRole("link", { name: ONION }).click();
  const follow = page.getByRole("button", { name: "Follow Onion" });
  await follow.click();
  await expect(page.getByRole("button", { name: "Following Onion" })).toBeVisible();
  await page.goto("/following");
  await expect(page.getByTestId("follow-row")).toContainText(["Crop: Onion"]);
  await page.getByTestId("follow-row").filter({ hasText: "Crop: Onion" }).getByRole("button", { name: "Stop following" }).click();
  await expect(page.getByTestId("follow-row")).toHaveCount(0);
});
