import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Op } from "sequelize";
import { maxAttempts, nextAttemptAfterFailure, processMailQueueOnce, queueMail, retryMailNow } from "@/lib/mail/queue";
import { escapeHtml, renderMail } from "@/lib/mail/templates";
import { MailMessage } from "@/models";
import { testDatabase } from "../support/database";
import { testEnvironment } from "../support/environment";
import { caught, deadTransport, mailTo, uniqueAddress, waitForMail } from "./support";

const minutes = (n: number) => n * 60_000;
// Rows scheduled an hour ahead, so a running app server's worker leaves them to this suite.
const future = () => new Date(Date.now() + minutes(60));
const made: string[] = [];

async function queued(to: string, notBefore: Date) {
  const mail = renderMail({ subject: `Queue test ${to}`, paragraphs: ["A queued message."], action: { label: "Open", url: "http://127.0.0.1/x" } });
  const row = await queueMail({ kind: "test", to, ...mail }, { notBefore });
  made.push(row.id);
  return row;
}

beforeAll(() => {
  testDatabase();
});

afterAll(async () => {
  await MailMessage.destroy({ where: { id: { [Op.in]: made } } });
});

describe("mail templates", () => {
  it("escapes people's text in HTML and keeps absolute links in both parts", () => {
    const mail = renderMail({ subject: "S", paragraphs: ['Trial <b>"Weeds & more"</b>'], action: { label: "Go", url: "http://127.0.0.1:3000/trials/1?a=1&b=2" } });
    expect(mail.html).toContain(escapeHtml('Trial <b>"Weeds & more"</b>'));
    expect(mail.html).not.toContain("<b>");
    expect(mail.html).toContain('href="http://127.0.0.1:3000/trials/1?a=1&amp;b=2"');
    expect(mail.text).toContain("Go: http://127.0.0.1:3000/trials/1?a=1&b=2");
  });
});

describe("the mail queue", () => {
  it("retries after 1, 5, 30 and 120 minutes, then gives up", () => {
    const now = new Date("2026-06-01T00:00:00Z");
    expect([1, 2, 3, 4].map((attempts) => (nextAttemptAfterFailure(attempts, now)!.getTime() - now.getTime()) / 60_000)).toEqual([1, 5, 30, 120]);
    expect(nextAttemptAfterFailure(5, now)).toBeNull();
    expect(maxAttempts).toBe(5);
  });

  it("keeps a message when the catcher is down and delivers it once the catcher is back", async () => {
    const to = uniqueAddress("down");
    const start = future();
    const row = await queued(to, start);
    const down = await processMailQueueOnce({ transport: await deadTransport(), now: start, ids: [row.id] });
    expect(down).toMatchObject({ claimed: 1, sent: 0, retrying: 1 });
    await row.reload();
    expect(row.status).toBe("pending");
    expect(row.attempts).toBe(1);
    expect(row.lastError).toMatch(/ECONNREFUSED|connect/i);
    expect(row.nextAttemptAt.getTime() - start.getTime()).toBe(minutes(1));

    // Not due yet: nothing happens before the backoff has passed.
    expect((await processMailQueueOnce({ now: new Date(start.getTime() + 30_000), ids: [row.id] })).claimed).toBe(0);

    const back = await processMailQueueOnce({ now: new Date(start.getTime() + minutes(2)), ids: [row.id] });
    expect(back).toMatchObject({ claimed: 1, sent: 1 });
    await row.reload();
    expect(row.status).toBe("sent");
    expect(row.lastError).toBeNull();
    const mail = await waitForMail(mailTo(to));
    expect(mail.subject).toBe(`Queue test ${to}`);
    expect(mail.html).toContain("A queued message.");
  });

  it("marks a message failed after five failed attempts, with the last error, and an admin retry sends it", async () => {
    const to = uniqueAddress("failing");
    let now = future();
    const row = await queued(to, now);
    const transport = await deadTransport();
    for (let attempt = 1; attempt <= 5; attempt += 1) {
      const outcome = await processMailQueueOnce({ transport, now, ids: [row.id] });
      expect(outcome.claimed).toBe(1);
      await row.reload();
      now = new Date(row.nextAttemptAt.getTime() + 1000);
    }
    expect(row.status).toBe("failed");
    expect(row.attempts).toBe(5);
    expect(row.lastError).toBeTruthy();
    expect((await processMailQueueOnce({ now: new Date(now.getTime() + minutes(600)), ids: [row.id] })).claimed).toBe(0);

    expect(await retryMailNow(row.id)).toBe(true);
    await row.reload();
    expect(row.status).toBe("pending");
    await processMailQueueOnce({ ids: [row.id] });
    await waitForMail(mailTo(to));
  });

  it("lets two workers run at once without sending anything twice", async () => {
    const start = future();
    const addresses = Array.from({ length: 6 }, (_, index) => uniqueAddress(`parallel${index}`));
    const rows = [];
    for (const to of addresses) rows.push(await queued(to, start));
    const ids = rows.map((row) => row.id);
    const [first, second] = await Promise.all([
      processMailQueueOnce({ now: start, ids, limit: 6 }),
      processMailQueueOnce({ now: start, ids, limit: 6 }),
    ]);
    expect(first.sent + second.sent).toBe(6);
    for (const to of addresses) await waitForMail(mailTo(to));
    const all = await caught();
    for (const to of addresses) expect(all.filter(mailTo(to))).toHaveLength(1);
  });

  it("reaches the catcher named by MAIL_CATCHER_URL", () => {
    expect(testEnvironment().mailCatcherUrl).toMatch(/^http:\/\/127\.0\.0\.1:\d+$/);
  });
});
