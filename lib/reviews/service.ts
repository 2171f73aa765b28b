import "server-only";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";
import { AppError } from "@/lib/errors";
import { notify } from "@/lib/notifications/notify";
import { AuditEvent, ReviewComment, ReviewRequest, Trial } from "@/models";

/**
 * Review and sign-off: the owner asks for review of an active trial, the trial's reviewers
 * comment per assessment and approve, which locks the trial. Each step is audited.
 */
export async function requestReview(trial: Trial, userId: string, message: string): Promise<ReviewRequest> {
  if (trial.status !== "active") throw new AppError("CONFLICT", `Only an active trial can be sent for review; this one is ${trial.status}.`);
  const sequelize = db();
  const request = await sequelize.transaction(async (transaction) => {
    const open = await ReviewRequest.findOne({ where: { trialId: trial.id, status: "requested" }, transaction, lock: transaction.LOCK.UPDATE });
    if (open) throw new AppError("CONFLICT", "Review has already been requested for this trial.");
    const created = await ReviewRequest.create({ trialId: trial.id, requestedById: userId, message }, { transaction });
    await AuditEvent.create(
      { trialId: trial.id, userId, entityType: "review", entityId: created.id, action: "create", summary: "Review requested", oldValue: null, newValue: { message }, source: "review", reason: null },
      { transaction },
    );
    await notify({ type: "review-requested", trialId: trial.id, actorId: userId }, { transaction });
    return created;
  });
  return request;
}

/**
 * The owner takes an open request back (data still coming in, a mistake found): the request is
 * closed as withdrawn, the reviewers can no longer approve it, and a new request can follow.
 */
export async function withdrawReview(trial: Trial, userId: string): Promise<ReviewRequest> {
  return db().transaction(async (transaction) => {
    const open = await ReviewRequest.findOne({ where: { trialId: trial.id, status: "requested" }, transaction, lock: transaction.LOCK.UPDATE });
    if (!open) throw new AppError("CONFLICT", "There is no open review request to withdraw.");
    await open.update({ status: "withdrawn", decidedById: userId, decidedAt: new Date() }, { transaction });
    await AuditEvent.create(
      { trialId: trial.id, userId, entityType: "review", entityId: open.id, action: "update", summary: "Review request withdrawn", oldValue: { status: "requested" }, newValue: { status: "withdrawn" }, source: "review", reason: null },
      { transaction },
    );
    return open;
  });
}

export async function addComment(trial: Trial, userId: string, input: { body: string; assessmentId: string | null; parentId: string | null }): Promise<ReviewComment> {
  if (input.assessmentId) {
    const [found] = await db().query("SELECT 1 FROM assessments WHERE id = :id AND trial_id = :trialId", { replacements: { id: input.assessmentId, trialId: trial.id }, type: QueryTypes.SELECT });
    if (!found) throw new AppError("INVALID_INPUT", "That assessment is not part of this trial.", [{ path: "assessmentId", message: "Not an assessment of this trial." }]);
  }
  let parentId = input.parentId;
  let assessmentId = input.assessmentId;
  if (parentId) {
    const parent = await ReviewComment.findOne({ where: { id: parentId, trialId: trial.id } });
    if (!parent) throw new AppError("INVALID_INPUT", "The comment you reply to is not in this trial.", [{ path: "parentId", message: "Unknown comment." }]);
    // Threads are one level deep: a reply to a reply joins the thread's first comment.
    parentId = parent.parentId ?? parent.id;
    assessmentId = parent.assessmentId;
  }
  return db().transaction(async (transaction) => {
    const comment = await ReviewComment.create({ trialId: trial.id, assessmentId, parentId, authorId: userId, body: input.body }, { transaction });
    await notify({ type: "comment-added", trialId: trial.id, assessmentId, commentId: comment.id, actorId: userId }, { transaction });
    return comment;
  });
}

export async function setResolved(trial: Trial, userId: string, commentId: string, resolved: boolean): Promise<ReviewComment> {
  const comment = await ReviewComment.findOne({ where: { id: commentId, trialId: trial.id } });
  if (!comment) throw new AppError("NOT_FOUND", "That comment does not exist or is not visible to you.");
  if (comment.parentId) throw new AppError("INVALID_INPUT", "Resolve the thread from its first comment.");
  await comment.update({ resolvedAt: resolved ? new Date() : null, resolvedById: resolved ? userId : null });
  return comment;
}

/** The reviewer's sign-off: closes the open request and locks the trial (active → locked), in one transaction. */
export async function approveTrial(trial: Trial, userId: string, note: string): Promise<ReviewRequest> {
  const sequelize = db();
  const approved = await sequelize.transaction(async (transaction) => {
    const current = await Trial.findByPk(trial.id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!current || current.status !== "active") throw new AppError("CONFLICT", `Only an active trial can be approved; this one is ${current?.status ?? "gone"}.`);
    const open = await ReviewRequest.findOne({ where: { trialId: trial.id, status: "requested" }, transaction, lock: transaction.LOCK.UPDATE });
    if (!open) throw new AppError("CONFLICT", "The researcher has not asked for review yet.");
    await open.update({ status: "approved", decidedById: userId, decidedAt: new Date(), decisionNote: note || null }, { transaction });
    await current.update({ status: "locked" }, { transaction });
    await AuditEvent.create(
      { trialId: trial.id, userId, entityType: "trial", entityId: trial.id, action: "update", summary: "Approved by the reviewer; trial locked", oldValue: { status: "active" }, newValue: { status: "locked", note }, source: "review", reason: null },
      { transaction },
    );
    await notify({ type: "trial-approved", trialId: trial.id, actorId: userId }, { transaction });
    return open;
  });
  return approved;
}
