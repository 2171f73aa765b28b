import { signIn } from "./support/session";
import { writeFileSync } from "node:fs";
import { expect, test, type Page } from "@playwright/test";
import pg from "pg";

const PASSWORD = "hoebench-demo";
const TITLE = "Lettuce weed control: mulches, flame, cultivation and a solar weeding robot (second site)";


let lockedTrialId: string | null = null;

// The demo's second lettuce site is put back as it was (active, never reviewed), so other browser tests see the demo unchanged.
test.afterAll(async () => {
  if (!lockedTrialId || !process.env.DATABASE_URL) return;
  const client = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await client.connect();
  try {
    await client.query("DELETE FROM review_comments WHERE trial_id = $1", [lockedTrialId]);
    await client.query("DELETE FROM review_requests WHERE trial_id = $1", [lockedTrialId]);
    await client.query("UPDATE trials SET status = 'active' WHERE id = $1", [lockedTrialId]);
  } finally {
    await client.end();
  }
});

test("researcher asks for review, reviewer comments and approves, the trial locks and edits need a reason", async ({ page }) => {
  test.setTimeout(180_000);
  await signIn(page, "researcher@hoebench.test");
  await page.goto("/trials");
  await page.getByRole("link", { name: TITLE, exact: true }).click();
  await expect(page).toHaveURL(/\/trials\/[0-9a-f-]{36}$/);
  const trialId = page.url().split("/trials/")[1];
  lockedTrialId = trialId;
  await page.goto(`/trials/${trialId}/review`);
  // Asked too early, taken back, asked again.
  await page.getByRole("button", { name: "Request review" }).click();
  await expect(page.getByTestId("review-status")).toContainText("Review requested");
  await page.getByRole("button", { name: "Withdraw the review request" }).click();
  await expect(page.getByTestId("review-status")).toContainText("Review withdrawn");
  await expect(page.getByTestId("review-status")).toContainText("withdrawn by Petra Quillfeather");
  await page.screenshot({ path: "test-results/review-withdrawn.png", fullPage: false });
  await page.getByLabel("Message to the reviewers (optional)").fill("All five assessments are in.");
  await page.getByRole("button", { name: "Request review" }).click();
  await expect(page.getByTestId("review-status")).toContainText("Review requested");

  await signIn(page, "reviewer@hoebench.test");
  await expect(page.getByTestId("review-queue")).toContainText(TITLE);
  await expect(page.getByTestId("review-queue").getByRole("listitem").filter({ hasText: TITLE })).toContainText("Review requested");
  await page.getByTestId("review-queue").getByRole("link", { name: TITLE }).click();
  const density = page.getByTestId("review-assessment").filter({ hasText: "Weed density, 14 days after planting" });
  await density.getByLabel("New comment").fill("Why is the flame plot in block 2 so weedy?");
  await density.getByRole("button", { name: "Add comment" }).click();
  await expect(density.getByTestId("comment-thread")).toContainText("Why is the flame plot");
  await density.getByLabel("Reply").fill("Wind blew the flame off the row that day.");
  await density.getByRole("button", { name: "Reply" }).click();
  await expect(density.getByTestId("comment-thread")).toContainText("Wind blew");
  await density.getByRole("button", { name: "Resolve" }).click();
  await expect(density.getByTestId("comment-thread")).toContainText("Resolved by");
  await page.screenshot({ path: "test-results/review-comments.png", fullPage: true });
  await page.getByLabel("Sign-off note (optional)").fill("Analyses read; approved.");
  await page.getByRole("button", { name: "Approve and lock the trial" }).click();
  await expect(page.getByTestId("review-status")).toContainText("Approved by reviewer");
  await expect(page.getByText("Locked", { exact: true }).first()).toBeVisible();

  await signIn(page, "technician@hoebench.test");
  await page.goto(`/trials/${trialId}/plots/101`);
  await expect(page.getByText("Why does locked data change?")).toBeVisible();

  await signIn(page, "researcher@hoebench.test");
  await page.goto(`/trials/${trialId}/report`);
  await expect(page.getByTestId("sign-off")).toContainText("Approved by");
  await expect(page.getByTestId("report-assessment").first()).toBeVisible();
  await page.emulateMedia({ media: "print" });
  await page.screenshot({ path: "test-results/report-print.png", fullPage: true });
  await page.emulateMedia({ media: "screen" });
  const pdf = await page.request.get(`/api/reports/${trialId}/pdf`);
  expect(pdf.status()).toBe(200);
  const bytes = await pdf.body();
  expect(bytes.subarray(0, 5).toString()).toBe("%PDF-");
  writeFileSync("test-results/technical-report.pdf", bytes);
});
