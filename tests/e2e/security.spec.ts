import { signIn } from "./support/session";
import { expect, test, type Page } from "@playwright/test";


test("every page works under the content security policy, charts included", async ({ page }) => {
  const violations: string[] = [];
  await page.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (event) => {
      (window as unknown as { __violations: string[] }).__violations ??= [];
      (window as unknown as { __violations: string[] }).__violations.push(`${event.violatedDirective} ${event.blockedURI}`);
    });
  });
  page.on("console", (message) => {
    if (/Content Security Policy/i.test(message.text())) violations.push(message.text());
  });

  const response = await page.goto("/signin");
  expect(response?.headers()["content-security-policy"]).toContain("default-src 'self'");
  expect(response?.headers()["x-frame-options"]).toBe("DENY");
  await signIn(page, "researcher@hoebench.test");

  await page.goto("/trials");
  await page.getByRole("link", { name: "Lettuce weed control: mulches, flame, cultivation and a solar weeding robot", exact: true }).click();
  await expect(page).toHaveURL(/\/trials\/[0-9a-f-]{36}$/);
  const trialUrl = page.url();
  for (const path of ["", "/map", "/labels", "/data", "/results", "/report", "/audit"]) {
    await page.goto(`${trialUrl}${path}`);
    await page.waitForLoadState("networkidle");
  }
  await page.goto(`${trialUrl}/results`);
  const firstResult = page.locator('a[href*="/results/"]').first();
  await firstResult.click();
  await expect(page.locator(".js-plotly-plot").first()).toBeVisible({ timeout: 30_000 });
  await page.waitForLoadState("networkidle");
  await page.goto("/library");
  await page.waitForLoadState("networkidle");

  const reported = await page.evaluate(() => (window as unknown as { __violations?: string[] }).__violations ?? []);
  expect([...violations, ...reported]).toEqual([]);
});
