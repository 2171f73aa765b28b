import { signIn } from "./support/session";
import { expect, test, type Browser, type Page } from "@playwright/test";
import { Op, type Sequelize } from "sequelize";
import { Invitation, User } from "@/models";
import { createTrialFixture, type TrialFixture } from "../factories/trials";
import { createSequelize } from "@/lib/db/sequelize";
import { testEnvironment } from "../support/environment";

const DEMO_PASSWORD = "hoebench-demo";
const shots = `${process.env.HOEBENCH_TEST_SLOT ? `test-results-${process.env.HOEBENCH_TEST_SLOT}` : "test-results"}`;

interface CaughtMail {
  receivedAt: string;
  to: string[];
  subject: string;
  text: string;
}

async function waitForMail(to: string, subjectPart: string, notContaining?: string): Promise<CaughtMail> {
  const deadline = Date.now() + 20_000;
  for (;;) {
    const response = await fetch(new URL("/messages", process.env.MAIL_CATCHER_URL));
    const mail = ((await response.json()) as CaughtMail[]).find(
      (candidate) => candidate.to.includes(to) && candidate.subject.includes(subjectPart) && (!notContaining || !candidate.text.includes(notContaining)),
    );
    if (mail) return mail;
    if (Date.now() > deadline) throw new Error(`no mail "${subjectPart}" to ${to}`);
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
}

function link(mail: CaughtMail, pathPrefix: string): string {
  const found = (mail.text.match(/https?:\/\/\S+/g) ?? []).find((url) => new URL(url).pathname.startsWith(pathPrefix));
  if (!found) throw new Error(`no ${pathPrefix} link in "${mail.subject}"`);
  return found;
}


async function freshPage(browser: Browser): Promise<Page> {
  return (await browser.newContext()).newPage();
}

function densityFile(fixture: TrialFixture): string {
  return ["plot,quadrat,species,value", ...fixture.plots.flatMap((plot) => [1, 2].map((quadrat) => `${plot.number},${quadrat},,${(plot.number % 7) + quadrat}`))].join("\n");
}

let fixture: TrialFixture;
let sequelize: Sequelize;
const invitee = `nadia-${Date.now().toString(36)}@example.test`;

test.beforeAll(async () => {
  // Its own connection, bound to the models: other specs in this worker may close the shared one.
  sequelize = createSequelize(testEnvironment().databaseUrl, 2);
  fixture = await createTrialFixture({ ownerEmail: "researcher@hoebench.test" });
});

test.afterAll(async () => {
  await Invitation.destroy({ where: { trialId: fixture.trial.id } });
  await sequelize.query("DELETE FROM trials WHERE id = :id", { replacements: { id: fixture.trial.id } });
  await sequelize.query("DELETE FROM sites WHERE id = :id", { replacements: { id: fixture.trial.siteId } });
  await User.destroy({ where: { email: { [Op.in]: [invitee] } } });
});

test("a researcher invites a technician by e-mail; the technician joins from the caught mail, uploads, and the researcher is told; then resets a password", async ({ page, browser }) => {
  test.setTimeout(120_000);
  const title = fixture.trial.title;

  // The researcher invites from the trial's team step.
  await signIn(page, "researcher@hoebench.test");
  await page.goto(`/trials/${fixture.trial.id}/plan/team`);
  const invite = page.getByTestId("invite-by-email");
  await invite.getByLabel("E-mail").fill(invitee);
  await invite.getByLabel("Role").selectOption("technician");
  await invite.getByRole("button", { name: "Send invitation" }).click();
  await expect(invite.getByRole("status")).toHaveText(`Invitation sent to ${invitee}.`);
  await expect(invite.getByTestId("invitation")).toContainText("Waiting for an answer");
  await page.screenshot({ path: `${shots}/mail-01-invite-sent.png`, fullPage: true });

  // The technician opens the link from the caught mail and creates an account.
  const invitation = await waitForMail(invitee, "invites you");
  const inviteLink = link(invitation, "/invite/");
  expect(inviteLink.startsWith(process.env.APP_BASE_URL!)).toBe(true);
  const technician = await freshPage(browser);
  await technician.goto(inviteLink);
  await expect(technician.getByRole("heading", { name: `Join “${title}”` })).toBeVisible();
  await technician.getByLabel("Name").fill("Nadia Rowhoe");
  await technician.getByLabel("Password (at least 10 characters)").fill("quadrat-count-42");
  await technician.getByLabel("Password again").fill("quadrat-count-42");
  await technician.screenshot({ path: `${shots}/mail-02-accept-invitation.png`, fullPage: true });
  await technician.getByRole("button", { name: "Create account and join" }).click();
  await expect(technician).toHaveURL(new RegExp(`/trials/${fixture.trial.id}$`));
  await expect(technician.getByTestId("signed-in-as")).toContainText("Nadia Rowhoe · Technician");

  // …and uploads the first data.
  await technician.goto(`/trials/${fixture.trial.id}/data/${fixture.assessment.id}`);
  await technician.getByLabel("CSV file").setInputFiles({ name: "density.csv", mimeType: "text/csv", buffer: Buffer.from(densityFile(fixture)) });
  await expect(technician.getByTestId("upload-preview")).toContainText("0 errors", { timeout: 30_000 });
  await technician.getByRole("button", { name: /Confirm and save/ }).click();
  await expect(technician.getByRole("status").filter({ hasText: /Saved as version 1/ })).toBeVisible();

  // The researcher hears of it by mail, with a link that works.
  const notice = await waitForMail("researcher@hoebench.test", `New data for ${title}`);
  expect(notice.text).toContain("Nadia Rowhoe uploaded version 1");
  await page.goto(link(notice, "/trials/"));
  await expect(page.getByTestId("versions")).toContainText("Nadia Rowhoe");

  // The invitation link was used; a second visit says so.
  const again = await freshPage(browser);
  await again.goto(inviteLink);
  await expect(again.getByTestId("link-problem")).toContainText("already been used");
  await again.screenshot({ path: `${shots}/mail-03-invitation-used.png`, fullPage: true });

  // The technician forgets the password and resets it from the sign-in page.
  const reset = await freshPage(browser);
  await reset.goto("/signin");
  await reset.getByRole("link", { name: "Forgot password?" }).click();
  await expect(reset.getByRole("heading", { name: "Forgot your password?" })).toBeVisible();
  await reset.getByLabel("E-mail").fill(invitee);
  await reset.getByRole("button", { name: "Send me a link" }).click();
  await expect(reset.getByTestId("reset-requested")).toContainText("If an account exists for that address");
  await reset.screenshot({ path: `${shots}/mail-04-reset-requested.png`, fullPage: true });
  const resetMail = await waitForMail(invitee, "new Hoebench password");
  const resetLink = link(resetMail, "/reset-password/");
  await reset.goto(resetLink);
  await reset.getByLabel("New password (at least 10 characters)").fill("fresh-furrow-77");
  await reset.getByLabel("New password again").fill("fresh-furrow-77");
  await reset.screenshot({ path: `${shots}/mail-05-reset-form.png`, fullPage: true });
  await reset.getByRole("button", { name: "Set the new password" }).click();
  await expect(reset.getByTestId("reset-done")).toBeVisible();
  await signIn(reset, invitee, "fresh-furrow-77");
  await expect(reset.getByTestId("signed-in-as")).toContainText("Nadia Rowhoe");

  const reused = await freshPage(browser);
  await reused.goto(resetLink);
  await expect(reused.getByTestId("link-problem")).toContainText("already been used");
  await reused.screenshot({ path: `${shots}/mail-06-reset-link-used.png`, fullPage: true });

  // An admin sees all of it in the caught mail (as HTML, links clickable) and the queue.
  const admin = await freshPage(browser);
  await signIn(admin, "admin@hoebench.test");
  await expect(admin.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Caught mail" })).toBeVisible();
  await admin.goto("/admin/mail");
  await expect(admin.getByRole("heading", { name: "Caught mail" })).toBeVisible();
  const frame = admin.frameLocator(`iframe[title="Mail: ${invitation.subject}"]`).first();
  await expect(frame.getByRole("link", { name: "Accept the invitation" })).toHaveAttribute("href", inviteLink, { timeout: 20_000 });
  await admin.screenshot({ path: `${shots}/mail-07-caught-mail.png` });
  // Links in the sandboxed preview open in a new tab, where the used invitation says so.
  const [opened] = await Promise.all([admin.context().waitForEvent("page"), frame.getByRole("link", { name: "Accept the invitation" }).click()]);
  await expect(opened.getByTestId("link-problem")).toContainText("already been used");
  await opened.close();
  await admin.goto("/admin/mail-queue");
  await expect(admin.getByTestId("queued-mail").filter({ hasText: invitee }).first()).toContainText("sent");
  await admin.screenshot({ path: `${shots}/mail-08-mail-queue.png`, fullPage: true });
});

test("settings: a person chooses the daily digest and fewer kinds of notice", async ({ page }) => {
  await signIn(page, "reviewer@hoebench.test");
  await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Settings" }).click();
  await page.getByLabel("A comment on a trial I own or review").uncheck();
  await page.getByLabel("One daily digest with everything from the day before").check();
  await page.getByRole("button", { name: "Save settings" }).click();
  await expect(page.getByRole("status")).toHaveText("Saved.");
  await page.reload();
  await expect(page.getByLabel("A comment on a trial I own or review")).not.toBeChecked();
  await expect(page.getByLabel("One daily digest with everything from the day before")).toBeChecked();
  await page.screenshot({ path: `${shots}/mail-09-settings.png`, fullPage: true });
  // Back to the defaults, so other tests meet the demo as seeded.
  await page.getByLabel("A comment on a trial I own or review").check();
  await page.getByLabel("One e-mail for each notice, as it happens").check();
  await page.getByRole("button", { name: "Save settings" }).click();
  await expect(page.getByRole("status")).toHaveText("Saved.");
});
