import "server-only";
import type { Transaction } from "sequelize";
import type { Transporter } from "nodemailer";
import { QueryTypes } from "sequelize";
import { config } from "@/lib/config";
import { db } from "@/lib/db/sequelize";
import { MailMessage } from "@/models";
import { mailTransport } from "./transport";
import type { RenderedMail } from "./templates";

export interface OutgoingMail extends RenderedMail {
  kind: string;
  to: string;
}

/** Waits after the 1st, 2nd, 3rd and 4th failed attempt; the 5th failure is final. */
export const retryDelaysMs = [60_000, 5 * 60_000, 30 * 60_000, 2 * 60 * 60_000] as const;
export const maxAttempts = retryDelaysMs.length + 1;
/** A row left "sending" by a server that stopped is picked up again after this. */
const sendingLeaseMs = 2 * 60_000;

/** When a message that has now failed `attempts` times is tried again; null when it has failed for good. */
export function nextAttemptAfterFailure(attempts: number, now: Date): Date | null {
  const delay = retryDelaysMs[attempts - 1];
  return delay === undefined ? null : new Date(now.getTime() + delay);
}

/** Writes a message to the queue; nothing is sent here, so the caller never waits on SMTP. */
export async function queueMail(mail: OutgoingMail, options: { transaction?: Transaction; notBefore?: Date } = {}): Promise<MailMessage> {
  db();
  return MailMessage.create(
    {
      kind: mail.kind,
      toAddress: mail.to,
      subject: mail.subject.slice(0, 300),
      textBody: mail.text,
      htmlBody: mail.html,
      nextAttemptAt: options.notBefore ?? new Date(),
    },
    { transaction: options.transaction },
  );
}

interface ClaimedRow {
  id: string;
  to_address: string;
  subject: string;
  text_body: string;
  html_body: string;
  attempts: number;
}

export interface QueueRunResult {
  claimed: number;
  sent: number;
  retrying: number;
  failed: number;
}

/**
 * Claims due messages with FOR UPDATE SKIP LOCKED (so several app servers can run this at
 * once without sending anything twice), sends each and records the outcome. Tests call it
 * directly; `now` and `ids` let them work on their own rows without waiting on clocks.
 */
export async function processMailQueueOnce(options: { transport?: Transporter; now?: Date; limit?: number; ids?: string[] } = {}): Promise<QueueRunResult> {
  const sequelize = db();
  const now = options.now ?? new Date();
  const result: QueueRunResult = { claimed: 0, sent: 0, retrying: 0, failed: 0 };
  if (options.ids && options.ids.length === 0) return result;
  const rows = await sequelize.query<ClaimedRow>(
    `UPDATE mail_messages SET status = 'sending', attempts = attempts + 1, locked_until = :lockedUntil, updated_at = :now
     WHERE id IN (
       SELECT id FROM mail_messages
       WHERE ((status = 'pending' AND next_attempt_at <= :now) OR (status = 'sending' AND locked_until < :now))
       ${options.ids ? "AND id IN (:ids)" : ""}
       ORDER BY next_attempt_at
       LIMIT :limit
       FOR UPDATE SKIP LOCKED)
     RETURNING id, to_address, subject, text_body, html_body, attempts`,
    {
      type: QueryTypes.SELECT,
      replacements: { now, lockedUntil: new Date(now.getTime() + sendingLeaseMs), limit: options.limit ?? 20, ids: options.ids ?? [] },
    },
  );
  result.claimed = rows.length;
  const transport = options.transport ?? mailTransport();
  const from = config().MAIL_FROM;
  for (const row of rows) {
    try {
      await transport.sendMail({ from, to: row.to_address, subject: row.subject, text: row.text_body, html: row.html_body });
      await sequelize.query(
        `UPDATE mail_messages SET status = 'sent', sent_at = :now, locked_until = NULL, last_error = NULL, updated_at = :now WHERE id = :id AND status = 'sending'`,
        { replacements: { id: row.id, now: new Date(Math.max(Date.now(), now.getTime())) } },
      );
      result.sent += 1;
    } catch (error) {
      const next = nextAttemptAfterFailure(row.attempts, now);
      const message = (error instanceof Error ? error.message : String(error)).slice(0, 500);
      await sequelize.query(
        `UPDATE mail_messages SET status = :status, next_attempt_at = COALESCE(:next, next_attempt_at), locked_until = NULL, last_error = :message, updated_at = :now
         WHERE id = :id AND status = 'sending'`,
        { replacements: { id: row.id, status: next ? "pending" : "failed", next, message, now } },
      );
      if (next) result.retrying += 1;
      else result.failed += 1;
    }
  }
  return result;
}

/** An admin's "try again": back to the start of the retry schedule, due now. */
export async function retryMailNow(id: string): Promise<boolean> {
  const rows = await db().query(
    `UPDATE mail_messages SET status = 'pending', attempts = 0, next_attempt_at = now(), last_error = NULL, updated_at = now()
     WHERE id = :id AND status IN ('failed', 'pending') RETURNING id`,
    { type: QueryTypes.SELECT, replacements: { id } },
  );
  return rows.length > 0;
}
