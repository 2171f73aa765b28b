import "server-only";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";
import { MailMessage, type MailStatus } from "@/models/MailMessage";

export interface QueuedMailRow {
  id: string;
  kind: string;
  toAddress: string;
  subject: string;
  status: MailStatus;
  attempts: number;
  nextAttemptAt: Date;
  lastError: string | null;
  sentAt: Date | null;
  createdAt: Date;
}

/** The admin's view of the queue: newest first, optionally one status. */
export async function queuedMail(status?: MailStatus, limit = 200): Promise<QueuedMailRow[]> {
  db();
  const rows = await MailMessage.findAll({
    where: status ? { status } : {},
    attributes: ["id", "kind", "toAddress", "subject", "status", "attempts", "nextAttemptAt", "lastError", "sentAt", "createdAt"],
    order: [["createdAt", "DESC"]],
    limit,
  });
  return rows.map((row) => row.get({ plain: true }) as QueuedMailRow);
}

export async function queueCounts(): Promise<Record<MailStatus, number>> {
  const rows = await db().query<{ status: MailStatus; count: string }>(`SELECT status, count(*) AS count FROM mail_messages GROUP BY status`, { type: QueryTypes.SELECT });
  const counts: Record<MailStatus, number> = { pending: 0, sending: 0, sent: 0, failed: 0 };
  for (const row of rows) counts[row.status] = Number(row.count);
  return counts;
}
