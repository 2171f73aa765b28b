import type { Metadata } from "next";
import Link from "next/link";
import { ChangesAfterLock } from "@/components/review/ChangesAfterLock";
import { CommentThreads, type CommentItem } from "@/components/review/CommentThreads";
import { ReviewActions } from "@/components/review/ReviewActions";
import { num, pText } from "@/components/results/format";
import { TrialHeading } from "@/components/trials/TrialHeading";
import { TrialTabs } from "@/components/trials/TrialTabs";
import { assessmentResults, defaultControl, treatmentsOf } from "@/lib/analysis/assessment-results";
import { can } from "@/lib/auth/permissions";
import { assessmentsOf } from "@/lib/data/assessments";
import { changesAfterLockOf, commentsOf, reviewStateOf, reviewStatusText, type ReviewCommentView } from "@/lib/data/reviews";
import { trialForPage } from "@/lib/trials/page-access";
import { analysisOptionsSchema } from "@/lib/validations/analysis";

export const metadata: Metadata = { title: "Review" };
export const dynamic = "force-dynamic";

const asItem = (comment: ReviewCommentView): CommentItem => ({
  ...comment,
  createdAt: new Date(comment.createdAt).toISOString(),
  resolvedAt: comment.resolvedAt ? new Date(comment.resolvedAt).toISOString() : null,
});

export default async function ReviewPage({ params }: { params: Promise<{ trialId: string }> }) {
  const { trialId } = await params;
  const { user, trial } = await trialForPage(trialId, "analysis:read");
  const [review, comments, assessments, treatments, changesAfterLock] = await Promise.all([
    reviewStateOf(trial.id),
    commentsOf(trial.id),
    assessmentsOf(trial.id),
    treatmentsOf(trial.id),
    changesAfterLockOf(trial.id),
  ]);
  const summaries = await Promise.all(
    assessments.map((assessment) =>
      assessmentResults(trial, assessment.id, analysisOptionsSchema.parse({ control: defaultControl(treatments) })).then(({ results }) => results),
    ),
  );
  const mayComment = can(user.role, "review:comment") && trial.status !== "published";
  const open = review?.status === "requested";
  const status = review?.status ?? "none";
  return (
    <section className="space-y-6">
      <TrialHeading title={trial.title} status={trial.status} lines={[`${trial.crop} · ${trial.season}`]} />
      <TrialTabs trialId={trial.id} current="review" canPlan={can(user.role, "trial:edit")} />
      <div className="rounded border border-soil-200 bg-white p-4" data-testid="review-status">
        <p className="text-lg font-semibold">{reviewStatusText[status]}</p>
        {review && (
          <p className="text-sm text-soil-700">
            Requested by {review.requestedBy} on {new Date(review.createdAt).toISOString().slice(0, 10)}
            {review.message ? `: “${review.message}”` : ""}
            {review.decidedAt
              ? ` · ${review.status === "withdrawn" ? "withdrawn" : "approved"} by ${review.decidedBy} on ${new Date(review.decidedAt).toISOString().slice(0, 10)}${review.decisionNote ? `: “${review.decisionNote}”` : ""}`
              : ""}
          </p>
        )}
        {trial.status === "locked" && <p className="mt-1 text-sm">The trial is locked: data are read-only, and any later change needs a reason that appears in the audit trail.</p>}
      </div>
      <ChangesAfterLock trialId={trial.id} changes={changesAfterLock} locked={trial.status === "locked" || trial.status === "published"} />
      <ReviewActions
        trialId={trial.id}
        mayRequest={can(user.role, "review:request") && trial.status === "active" && !open}
        mayWithdraw={can(user.role, "review:request") && trial.status === "active" && open}
        mayApprove={can(user.role, "review:approve") && trial.status === "active" && open}
      />
      <section aria-labelledby="general-heading">
        <h2 id="general-heading" className="mb-2 text-lg font-semibold">About the whole trial</h2>
        <CommentThreads trialId={trial.id} assessmentId={null} comments={comments.filter((comment) => comment.assessmentId === null).map(asItem)} mayComment={mayComment} viewerName={user.name} />
      </section>
      {assessments.map((assessment, index) => {
        const results = summaries[index];
        const open = comments.filter((comment) => comment.assessmentId === assessment.id && !comment.parentId && !comment.resolvedAt).length;
        return (
          <section key={assessment.id} id={`assessment-${assessment.id}`} aria-labelledby={`heading-${assessment.id}`} className="space-y-2 rounded border border-soil-200 bg-white p-4" data-testid="review-assessment">
            <div className="flex flex-col gap-1 sm:flex-row sm:items-baseline sm:justify-between">
              <h2 id={`heading-${assessment.id}`} className="font-semibold">{assessment.name}</h2>
              <span className="text-xs text-soil-700">{open} open comment{open === 1 ? "" : "s"}</span>
            </div>
            {results.empty ? (
              <p className="text-sm text-soil-700">No data yet.</p>
            ) : (
              <p className="text-sm">
                Treatment F = {num(results.treatmentTest?.f)}, {pText(results.treatmentTest?.p)} · CV {num(results.cvPercent)}% · data version {results.dataVersion} ·{" "}
                <Link href={`/trials/${trial.id}/results/${assessment.id}`} className="text-leaf-700 underline">Full results</Link>
              </p>
            )}
            {results.warnings.length > 0 && (
              <ul className="ml-5 list-disc text-xs text-amber-900">
                {results.warnings.map((warning) => <li key={warning}>{warning}</li>)}
              </ul>
            )}
            <CommentThreads trialId={trial.id} assessmentId={assessment.id} comments={comments.filter((comment) => comment.assessmentId === assessment.id).map(asItem)} mayComment={mayComment} viewerName={user.name} />
          </section>
        );
      })}
    </section>
  );
}
