import "server-only";
import type { SessionUser } from "@/lib/auth/session";
import { editIsStale, summaryNumbersOf } from "@/lib/data/summaries";
import { db } from "@/lib/db/sequelize";
import { AppError } from "@/lib/errors";
import { notify } from "@/lib/notifications/notify";
import { AuditEvent, Trial, TrialSummary } from "@/models";
import { generateSummary } from "./generate";

const publishedAlready = () => new AppError("CONFLICT", "This trial is published; its summary can no longer change.");

const resultsChanged = () =>
  new AppError(
    "CONFLICT",
    "The results changed after the summary text was edited, so the text may quote old numbers. Compare it with the new generated text on the summary page and save it again (or take the new text) before publishing.",
  );

/**
 * Saves the researcher's edit (null returns to the generated text). Only before publishing.
 * Beside the edit it keeps the generated text the edit was made against (generatedText), so a
 * later change in the results shows as a difference from the text generated now. `basedOn` is
 * that text as the editor showed it; without it an earlier edit keeps its own, and a first
 * edit is taken to be against the text generated now.
 */
export async function saveSummaryEdit(user: SessionUser, trial: Trial, text: string | null, basedOn?: string): Promise<TrialSummary> {
  if (trial.status === "published") throw publishedAlready();
  db();
  const [record] = await TrialSummary.findOrCreate({ where: { trialId: trial.id }, defaults: { trialId: trial.id, editedText: null, publishedText: null, generatedText: null, numbers: null, publishedAt: null, publishedById: null, updatedById: user.id } });
  let generatedText: string | null = null;
  if (text !== null) {
    generatedText = basedOn ?? (record.editedText !== null ? record.generatedText : generateSummary((await summaryNumbersOf(trial)).input).text);
  }
  await record.update({ editedText: text, generatedText, updatedById: user.id });
  return record;
}

/**
 * Publishes a locked trial: stores the text growers will read (the researcher's edit, or the
 * generated text) with the numbers it came from, and moves the trial locked → published, in
 * one transaction that locks the trial row so two clicks cannot publish twice. An edit made
 * before the results changed is refused, so text and numbers cannot disagree. The demo seed
 * publishes its trial through here too (lib/demo/publish-demo-trials.ts).
 */
export async function publishTrial(user: SessionUser, trialId: string, options: { source?: string } = {}): Promise<{ publishedAt: Date }> {
  const numbers = await summaryNumbersOf((await Trial.findByPk(trialId))!);
  const generated = generateSummary(numbers.input);
  const publishedAt = await db().transaction(async (transaction) => {
    const trial = (await Trial.findByPk(trialId, { transaction, lock: transaction.LOCK.UPDATE }))!;
    if (trial.status === "published") throw publishedAlready();
    if (trial.status !== "locked") throw new AppError("CONFLICT", `Only a locked (reviewed) trial can be published; this one is ${trial.status}.`);
    const existing = await TrialSummary.findOne({ where: { trialId }, transaction });
    if (editIsStale(existing, generated.text)) throw resultsChanged();
    const text = existing?.editedText ?? generated.text;
    const now = new Date();
    const values = { publishedText: text, generatedText: generated.text, numbers, publishedAt: now, publishedById: user.id, updatedById: user.id };
    if (existing) await existing.update(values, { transaction });
    else await TrialSummary.create({ trialId, editedText: null, ...values }, { transaction });
    await trial.update({ status: "published" }, { transaction });
    await AuditEvent.create(
      {
        trialId,
        userId: user.id,
        entityType: "trial",
        entityId: trialId,
        action: "update",
        summary: `Published with its plain-language summary (${existing?.editedText ? "edited" : "generated"} text)`,
        oldValue: { status: "locked" },
        newValue: { status: "published" },
        source: options.source ?? "summary page",
        reason: null,
        afterLock: true,
      },
      { transaction },
    );
    // Queued with the publication itself: a crash after the commit cannot lose the followers' notice.
    await notify({ type: "trial-published", trialId, actorId: user.id }, { transaction });
    return now;
  });
  return { publishedAt };
}
