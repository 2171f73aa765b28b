import { afterAll, describe, expect, it } from "vitest";
import { processMailQueueOnce } from "@/lib/mail/queue";
import { MailMessage } from "@/models";
import { testDatabase } from "../support/database";
import { TestClient } from "../support/http";
import { startFakesAgain, stopFakes } from "../support/services";
import { createPerson, removePeople } from "../mail/people";
import { mailTo, waitForMail } from "../mail/support";

const minutes = (count: number) => count * 60_000;

describe("when the mail catcher goes away", () => {
  it("a password-reset request still succeeds, its mail waits in the queue, and goes out once the catcher is back", async () => {
    const person = await createPerson("grower", "outage");
    await stopFakes();
    let queued: MailMessage | null = null;
    try {
      const response = await new TestClient().request("/api/password-reset", { method: "POST", json: { email: person.email }, headers: { "x-forwarded-for": "203.0.113.77" } });
      expect(response.status).toBe(202);
      queued = await MailMessage.findOne({ where: { toAddress: person.email } });
      expect(queued).not.toBeNull();
      // Whoever tries to send it now (the app's worker or this run) meets the real, stopped catcher.
      const attempt = await processMailQueueOnce({ ids: [queued!.id], now: new Date(Date.now() + minutes(1)) });
      expect(attempt.sent).toBe(0);
      await queued!.reload();
      expect(queued!.status).toBe("pending");
      expect(queued!.attempts).toBeGreaterThanOrEqual(1);
      expect(queued!.lastError).toMatch(/ECONNREFUSED|connect/i);
    } finally {
      await startFakesAgain();
    }
    // Past any backoff a failed attempt set (unless the app's own worker got there first).
    await processMailQueueOnce({ ids: [queued!.id], now: new Date(Date.now() + minutes(180)) });
    expect((await queued!.reload()).status).toBe("sent");
    const mail = await waitForMail(mailTo(person.email, "new Hoebench password"));
    expect(mail.text).toContain("/reset-password/");
  }, 60_000);
});

afterAll(async () => {
  await removePeople();
  await testDatabase().close();
});
