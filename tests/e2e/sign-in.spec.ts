import { expect, test, type Page } from "@playwright/test";

const PASSWORD = "hoebench-demo";

async function signIn(page: Page, email: string, password = PASSWORD) {
  await page.goto("/signin");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}

test("a researcher signs in, sees their own navigation and trials, and signs out", async ({ page }) => {
  await signIn(page, "researcher@hoebench.test");
  await expect(page.getByRole("heading", { name: "My trials" })).toBeVisible();
  const nav = page.getByRole("navigation", { name: "Main" });
  await expect(nav.getByRole("link", { name: "My trials" })).toBeVisible();
  await expect(nav.getByRole("link", { name: "Users" })).toHaveCount(0);
  await expect(page.getByTestId("signed-in-as")).toHaveText("Petra Quillfeather · Researcher");
  await expect(page.getByTestId("trial-row").first()).toBeVisible();
  await page.screenshot({ path: "test-results/researcher-home.png", fullPage: true });

  await page.getByRole("button", { name: "Sign out" }).click();
  await expect(page).toHaveURL(/\/signin/);
  await page.goto("/");
  await expect(page).toHaveURL(/\/signin/);
});

test("an admin sees the user administration in the navigation", async ({ page }) => {
  await signIn(page, "admin@hoebench.test");
  const nav = page.getByRole("navigation", { name: "Main" });
  await expect(nav.getByRole("link", { name: "Overview" })).toBeVisible();
  await nav.getByRole("link", { name: "Users" }).click();
  await expect(page.getByRole("heading", { name: "Users" })).toBeVisible();
  await expect(page.getByTestId("user-row")).toHaveCount(6);

  await page.getByRole("button", { name: "Sign out" }).click();
  await expect(page).toHaveURL(/\/signin/);
  await page.goto("/admin/users");
  await expect(page).toHaveURL(/\/signin/);
});

test("after signing in, a crafted return address stays on this site; a real one is honoured", async ({ page, baseURL }) => {
  await page.goto("/signin?callbackUrl=%2F%5Celsewhere.example%2Fphish");
  await page.getByLabel("E-mail").fill("technician@hoebench.test");
  await page.getByLabel("Password").fill(PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByRole("navigation", { name: "Main" })).toBeVisible();
  expect(new URL(page.url()).origin).toBe(new URL(baseURL!).origin);

  await page.goto("/signin?callbackUrl=%2F%2Felsewhere.example");
  await expect(page).toHaveURL(new RegExp(`^${new URL(baseURL!).origin}/`));
  await page.getByRole("button", { name: "Sign out" }).click();
  // Sign-out makes its own navigation; let it land first.
  await expect(page).toHaveURL(/\/signin/);
  await page.goto("/signin?callbackUrl=%2Fsettings%3Ffrom%3Dmail");
  await page.getByLabel("E-mail").fill("technician@hoebench.test");
  await page.getByLabel("Password").fill(PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page).toHaveURL(/\/settings\?from=mail$/);
});

test("a grower sees published results only", async ({ page }) => {
  await signIn(page, "grower@hoebench.test");
  await expect(page.getByRole("heading", { name: "Published results" })).toBeVisible();
  await expect(page.getByTestId("trial-row")).toHaveCount(1);
  await expect(page.getByTestId("trial-row")).toContainText("Onion");
  await page.goto("/admin/users");
  await expect(page.getByRole("heading", { name: "Not found" })).toBeVisible();
});

test("a wrong password gets one plain message that gives nothing away", async ({ page }) => {
  await signIn(page, "researcher@hoebench.test", "wrong-password");
  await expect(page.getByRole("alert").filter({ hasText: "do not match" })).toHaveText("That e-mail and password do not match an account.");
  await signIn(page, "nobody@hoebench.test", "wrong-password");
  await expect(page.getByRole("alert").filter({ hasText: "do not match" })).toHaveText("That e-mail and password do not match an account.");
});

test("the sign-in form shows what is missing next to the field", async ({ page }) => {
  await page.goto("/signin");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByText("Enter a valid e-mail address.")).toBeVisible();
  await expect(page.getByText("Enter your password.")).toBeVisible();
});

test("a grower registers, is signed in, and cannot register the same address twice", async ({ page }) => {
  const email = `new-grower-${Date.now()}@hoebench.test`;
  await page.goto("/register");
  await page.getByLabel("Name").fill("Mara Stubblefield");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password (at least 10 characters)").fill("a-long-enough-password");
  await page.getByLabel("Password again").fill("a-long-enough-password");
  await page.getByRole("button", { name: "Create account" }).click();
  await expect(page.getByRole("heading", { name: "Published results" })).toBeVisible();
  await expect(page.getByTestId("signed-in-as")).toHaveText("Mara Stubblefield · Grower");

  await page.getByRole("button", { name: "Sign out" }).click();
  // Sign-out ends with its own navigation to the sign-in page; going elsewhere before it lands races it.
  await expect(page).toHaveURL(/\/signin/);
  await page.goto("/register");
  await page.getByLabel("Name").fill("Mara Stubblefield");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password (at least 10 characters)").fill("a-long-enough-password");
  await page.getByLabel("Password again").fill("a-long-enough-password");
  await page.getByRole("button", { name: "Create account" }).click();
  await expect(page.getByText("An account with that e-mail address already exists.").first()).toBeVisible();
});

test("the phone layout folds the navigation into a menu", async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 844 });
  await signIn(page, "technician@hoebench.test");
  await expect(page.getByRole("heading", { name: "Trials I collect for" })).toBeVisible();
  await page.getByRole("button", { name: "Menu" }).click();
  await expect(page.getByRole("navigation", { name: "Main (mobile)" }).getByRole("link", { name: "Trials I collect for" })).toBeVisible();
  await page.screenshot({ path: "test-results/technician-phone.png", fullPage: true });
});
