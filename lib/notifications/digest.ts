import "server-only";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";
import { queueMail } from "@/lib/mail/queue";
import { renderMail } from "@/lib/mail/templates";
import { absoluteUrl } from "@/lib/mail/urls";
import { wakeMailWorker } from "@/lib/jobs/mail-worker";
import { User } from "@/models";

interface HeldItem {
  id: string;
  summary: string;
  link: string;
}

/**
 * The daily digest: each person's held notices become one mail. Items are marked in the same
 * transaction that queues the mail, so a crash never sends them twice or loses them.
 */
export async function sendDailyDigests(now = new Date()): Promise<number> {
  const sequelize = db();
  const people = await sequelize.query<{ user_id: string }>(
    `SELECT DISTINCT user_id FROM notification_digest_items WHERE digested_at IS NULL AND created_at <= :now`,
    { type: QueryTypes.SELECT, replacements: { now } },
  );
  let sent = 0;
  for (const { user_id: userId } of people) {
    await sequelize.transaction(async (transaction) => {
      const items = await sequelize.query<HeldItem>(
        `UPDATE notification_digest_items SET digested_at = :now, updated_at = :now
         WHERE id IN (SELECT id FROM notification_digest_items WHERE user_id = :userId AND digested_at IS NULL AND created_at <= :now FOR UPDATE SKIP LOCKED)
         RETURNING id, summary, link`,
        { type: QueryTypes.SELECT, replacements: { userId, now }, transaction },
      );
      const user = await User.findByPk(userId, { transaction });
      if (items.length === 0 || !user || !user.active) return;
      const mail = renderMail({
        subject: `Your Hoebench digest: ${items.length} ${items.length === 1 ? "notice" : "notices"}`,
        greeting: `Hello ${user.name},`,
        paragraphs: ["Here is what happened in your trials since the last digest."],
        items: items.map((item) => ({ text: item.summary, url: item.link })),
        footer: `You get one digest a day instead of a mail per notice. Change this under Settings: ${absoluteUrl("/settings")}`,
      });
      await queueMail({ kind: "digest", to: user.email, ...mail }, { transaction });
      sent += 1;
    });
  }
  if (sent > 0) wakeMailWorker();
  return sent;
}
