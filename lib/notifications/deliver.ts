import "server-only";
import type { Transaction } from "sequelize";
import { notificationPreferencesFor } from "@/lib/data/notification-settings";
import { db } from "@/lib/db/sequelize";
import { queueMail } from "@/lib/mail/queue";
import { renderMail } from "@/lib/mail/templates";
import { wakeMailWorker } from "@/lib/jobs/mail-worker";
import { NotificationDigestItem } from "@/models";
import type { NotificationType } from "./events";

export interface Recipient {
  id: string;
  email: string;
  name: string;
}

export interface NoticeContent {
  subject: string;
  /** One line, used in the digest. */
  summary: string;
  paragraphs: string[];
  link: { label: string; url: string };
}

export type DeliveryOutcome = "queued" | "digest" | "muted";

/**
 * Applies the recipient's settings: muted kinds are dropped, digest readers get it tomorrow.
 * Inside a transaction the worker is not woken: it could not see the row before the commit,
 * so whoever owns the transaction wakes it afterwards.
 */
export async function deliverNotice(recipient: Recipient, type: NotificationType, notice: NoticeContent, options: { transaction?: Transaction } = {}): Promise<DeliveryOutcome> {
  const { transaction } = options;
  const preferences = await notificationPreferencesFor(recipient.id, { transaction });
  if (preferences.muted.includes(type)) return "muted";
  if (preferences.delivery === "digest") {
    db();
    await NotificationDigestItem.create({ userId: recipient.id, type, summary: notice.summary, link: notice.link.url }, { transaction });
    return "digest";
  }
  const mail = renderMail({ subject: notice.subject, greeting: `Hello ${recipient.name},`, paragraphs: notice.paragraphs, action: notice.link });
  await queueMail({ kind: `notice:${type}`, to: recipient.email, ...mail }, { transaction });
  if (!transaction) wakeMailWorker();
  return "queued";
}
