import { signIn } from "./support/session";
import { expect, test, type Page } from "@playwright/test";
import { fieldPhotoPng } from "./support/png";

const PASSWORD = "hoebench-demo";


async function openLettuceTrial(page: Page) {
  await page.goto("/trials");
  await page.getByRole("link", { name: "Lettuce weed control: mulches, flame, cultivation and a solar weeding robot", exact: true }).click();
  await expect(page).toHaveURL(/\/trials\/[0-9a-f-]{36}$/);
  return page.url().split("/trials/")[1];
}

function densityFile(quadrats: number, bad?: { plot: number; value: string }): string {
  const lines = ["plot,quadrat,species,value"];
  for (const block of [1, 2, 3, 4]) {
    for (let position = 1; position <= 8; position += 1) {
      const plot = block * 100 + position;
      for (let quadrat = 1; quadrat <= quadrats; quadrat += 1) {
        lines.push(`${plot},${quadrat},,${bad && bad.plot === plot && quadrat === 1 ? bad.value : (plot % 9) + quadrat}`);
      }
    }
  }
  return lines.join("\n");
}

test("a technician uploads a sheet, fixes a bad row, re-uploads, enters a plot by phone and adds a photo; the researcher sees it all", async ({ page, browser }) => {
  test.setTimeout(120_000);
  await signIn(page, "technician@hoebench.test");
  const trialId = await openLettuceTrial(page);
  await page.getByRole("link", { name: "Field data" }).click();
  await page.getByRole("link", { name: /^Weed density/ }).first().click();
  await expect(page).toHaveURL(/\/data\/[0-9a-f-]{36}$/);
  const assessmentPath = new URL(page.url()).pathname;
  const quadrats = Number((await page.getByText(/quadrats? per plot/).first().textContent())!.match(/(\d+) quadrats? per plot/)![1]);

  // A slow line, so the progress bar is there to see.
  const cdp = await page.context().newCDPSession(page);
  await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 20, downloadThroughput: -1, uploadThroughput: 4 * 1024 });
  await page.getByLabel("CSV file").setInputFiles({ name: "density.csv", mimeType: "text/csv", buffer: Buffer.from(densityFile(quadrats, { plot: 203, value: "lots" })) });
  await expect(page.getByLabel("Upload progress")).toBeVisible();
  await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });

  const preview = page.getByTestId("upload-preview");
  await expect(preview).toBeVisible({ timeout: 30_000 });
  await expect(page.getByTestId("problem-list")).toContainText('"lots" for plot 203, quadrat 1 is not a number');
  await expect(preview).toContainText("Nothing has been saved");
  await expect(page.getByRole("button", { name: /Confirm and save/ })).toHaveCount(0);
  await page.screenshot({ path: "test-results/upload-refused.png", fullPage: true });

  await page.getByLabel("CSV file").setInputFiles({ name: "density-fixed.csv", mimeType: "text/csv", buffer: Buffer.from(densityFile(quadrats, { plot: 203, value: "7" })) });
  await expect(preview).toContainText("0 errors");
  await page.screenshot({ path: "test-results/upload-preview.png", fullPage: true });
  await page.getByRole("button", { name: /Confirm and save/ }).click();
  await expect(page.getByRole("status").filter({ hasText: /Saved as version \d+/ })).toBeVisible();
  // Once the page says its values are up to date, they are: read once, without waiting.
  await expect(page.getByRole("status").filter({ hasText: /Saved as version \d+/ })).toContainText("The values below are up to date.");
  const versions = page.getByTestId("versions");
  expect(await versions.textContent()).toContain("Upload of density-fixed.csv by Tomas Brindlewood");
  await versions.getByRole("link", { name: "What changed" }).first().click();
  await expect(page.getByRole("heading", { name: /Version \d+: what changed/ })).toBeVisible();

  // The phone at the stake of plot 101, with the connection dropping while saving.
  await page.setViewportSize({ width: 390, height: 844 });
  await page.goto(`/trials/${trialId}/plots/101`);
  await expect(page.getByTestId("plot-block")).toHaveText("1");
  await page.getByLabel(/^Quadrat 1$|^Value$/).fill("17");
  await expect(page.getByTestId("entry-state")).toHaveText("Not saved yet: kept on this phone.");
  // What was typed survives a reload before it is saved.
  await page.reload();
  await expect(page.getByLabel(/^Quadrat 1$|^Value$/)).toHaveValue("17");
  await expect(page.getByTestId("entry-state")).toHaveText("Not saved yet: kept on this phone.");
  // The connection drops while saving; the page says so and saves by itself when it returns.
  await page.context().setOffline(true);
  await page.getByRole("button", { name: "Save plot 101" }).click();
  await expect(page.getByTestId("entry-state")).toContainText("No connection. Your values are kept on this phone");
  await page.context().setOffline(false);
  await expect(page.getByTestId("entry-state")).toHaveText(/Saved as version \d+\./, { timeout: 30_000 });
  await page.reload();
  await expect(page.getByLabel(/^Quadrat 1$|^Value$/)).toHaveValue("17");
  await expect(page.getByTestId("entry-state")).toHaveText("Showing the saved values.");

  await page.getByLabel("Caption (optional)").fill("Purslane mat in the furrow");
  await page.getByLabel("Photo", { exact: true }).setInputFiles({ name: "plot101.png", mimeType: "image/png", buffer: fieldPhotoPng() });
  await expect(page.getByText("Photo saved.")).toBeVisible();
  await expect(page.getByTestId("plot-photos").getByRole("img", { name: "Purslane mat in the furrow" })).toBeVisible();
  await page.screenshot({ path: "test-results/plot-entry-phone.png", fullPage: true });

  const researcher = await browser.newPage();
  await signIn(researcher, "researcher@hoebench.test");
  await researcher.goto(`/trials/${trialId}/audit`);
  const trail = researcher.getByTestId("audit-trail");
  await expect(trail).toContainText("Tomas Brindlewood");
  await expect(trail).toContainText("for plot 101");
  await expect(trail).toContainText("for the whole assessment");
  await researcher.screenshot({ path: "test-results/audit-trail.png", fullPage: true });

  // The values themselves and their versions, as the researcher reads them.
  await researcher.goto(assessmentPath);
  await expect(researcher.getByTestId("versions")).toContainText("Upload of density-fixed.csv by Tomas Brindlewood");
  await expect(researcher.getByRole("heading", { name: "Plot values now" })).toBeVisible();
  await expect(researcher.getByRole("cell", { name: "203", exact: true }).first()).toBeVisible();
  await researcher.goto(`/trials/${trialId}/plots/101`);
  await expect(researcher.getByLabel(/^Quadrat 1$|^Value$/)).toHaveValue("17");
  await researcher.close();
});
