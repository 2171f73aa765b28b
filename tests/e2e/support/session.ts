import { expect, type Page } from "@playwright/test";

export const DEMO_PASSWORD = "hoebench-demo";

/** Signs a fresh session in through the sign-in form and waits until the app has let it in. */
export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.context().clearCookies();
  await page.goto("/signin");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page).not.toHaveURL(/signin/);
}
