import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { StatusBadge } from "@/components/trials/StatusBadge";
import { TeamInvitations } from "@/components/invitations/TeamInvitations";
import { AssessmentsStep } from "@/components/wizard/AssessmentsStep";
import { BasicsStep } from "@/components/wizard/BasicsStep";
import { DesignStep } from "@/components/wizard/DesignStep";
import { TeamStep } from "@/components/wizard/TeamStep";
import { TreatmentsStep } from "@/components/wizard/TreatmentsStep";
import { WizardNav } from "@/components/wizard/WizardNav";
import { can } from "@/lib/auth/permissions";
import { assessmentsOf } from "@/lib/data/assessments";
import { plotCount } from "@/lib/data/plots";
import { listSites } from "@/lib/data/sites";
import { treatmentsOf } from "@/lib/data/treatments";
import { teamCandidates, teamOf, trialsToCopyFrom } from "@/lib/data/trials";
import { editRefusal, pinnedDetailsNote, randomizeRefusal } from "@/lib/trials/edit-rules";
import { wizardSteps, type WizardStep } from "@/lib/trials/labels";
import { assessmentsWithObservations, hasObservations } from "@/lib/trials/observations";
import { trialForPage } from "@/lib/trials/page-access";

export const metadata: Metadata = { title: "Plan a trial" };
export const dynamic = "force-dynamic";

function ReadOnlyNotice({ reason }: { reason: string | null }) {
  if (!reason) return null;
  return (
    <p role="note" className="mb-4 rounded border border-soil-500 bg-soil-100 px-3 py-2 text-sm text-soil-900" data-testid="read-only-reason">
      {reason}
    </p>
  );
}

export default async function PlanStepPage({ params }: { params: Promise<{ trialId: string; step: string }> }) {
  const { trialId, step: rawStep } = await params;
  const step = wizardSteps.find((candidate) => candidate.key === rawStep)?.key as WizardStep | undefined;
  if (!step) notFound();
  const { user, trial } = await trialForPage(trialId, step === "team" ? "trial:manage-team" : "trial:edit");
  const observed = await hasObservations(trial.id);

  let body: React.ReactNode;
  let reason: string | null;
  switch (step) {
    case "basics": {
      reason = editRefusal("details", { status: trial.status, hasObservations: observed });
      const sites = await listSites();
      body = (
        <BasicsStep
          trialId={trial.id}
          initial={{ title: trial.title, crop: trial.crop, season: trial.season, siteId: trial.siteId, objective: trial.objective, plantingDate: trial.plantingDate ?? "" }}
          sites={sites}
          readOnlyReason={reason}
          pinnedNote={observed ? pinnedDetailsNote : null}
          canAddSite={can(user.role, "site:manage")}
        />
      );
      break;
    }
    case "treatments": {
      reason = editRefusal("structure", { status: trial.status, hasObservations: observed });
      const [treatments, sources, plots] = await Promise.all([treatmentsOf(trial.id), trialsToCopyFrom(user, trial.id), plotCount(trial.id)]);
      body = (
        <TreatmentsStep
          trialId={trial.id}
          initial={treatments.map((treatment) => ({
            id: treatment.id,
            code: treatment.code,
            name: treatment.name,
            category: treatment.category,
            checkType: treatment.checkType ?? "",
            description: treatment.description,
            timing: treatment.timing,
            rateOrSettings: treatment.rateOrSettings,
            labourHoursPerHa: treatment.labourHoursPerHa ?? "",
            materialCostPerHa: treatment.materialCostPerHa ?? "",
          }))}
          copySources={sources}
          readOnlyReason={reason}
          hasLayout={plots > 0}
        />
      );
      break;
    }
    case "design": {
      reason = editRefusal("structure", { status: trial.status, hasObservations: observed });
      const [treatments, plots] = await Promise.all([treatmentsOf(trial.id), plotCount(trial.id)]);
      body = (
        <DesignStep
          trialId={trial.id}
          initial={{
            design: trial.design,
            blocks: trial.blocks,
            plotLengthM: trial.plotLengthM,
            plotWidthM: trial.plotWidthM,
            harvestAreaM2: trial.harvestAreaM2,
            quadratAreaM2: trial.quadratAreaM2,
            serpentine: trial.serpentine,
            randomSeed: trial.randomSeed,
          }}
          treatmentCount={treatments.length}
          plotCount={plots}
          readOnlyReason={reason}
          canRandomize={can(user.role, "trial:randomize") && !randomizeRefusal(trial.status) && !observed}
        />
      );
      break;
    }
    case "assessments": {
      reason = editRefusal("assessment", { status: trial.status, hasObservations: false });
      const [assessments, pinned] = await Promise.all([assessmentsOf(trial.id), assessmentsWithObservations(trial.id)]);
      body = (
        <AssessmentsStep
          trialId={trial.id}
          initial={assessments.map((assessment) => ({
            id: assessment.id,
            name: assessment.name,
            variable: assessment.variable,
            unit: assessment.unit,
            plannedDate: assessment.plannedDate ?? "",
            timingDays: assessment.timingDays ?? "",
            timingReference: assessment.timingReference ?? "",
            quadratsPerPlot: assessment.quadratsPerPlot,
            notes: assessment.notes,
          }))}
          pinned={[...pinned]}
          readOnlyReason={reason}
        />
      );
      break;
    }
    case "team": {
      reason = editRefusal("team", { status: trial.status, hasObservations: false });
      const [members, candidates] = await Promise.all([teamOf(trial.id), teamCandidates()]);
      body = (
        <>
          <TeamStep trialId={trial.id} initial={members} candidates={candidates} readOnlyReason={reason} />
          <TeamInvitations trialId={trial.id} readOnlyReason={reason} />
        </>
      );
      break;
    }
  }

  return (
    <section>
      <p className="no-print mb-1 text-sm">
        <Link href={`/trials/${trial.id}`} className="text-leaf-700 underline">
          ← {trial.title}
        </Link>
      </p>
      <div className="mb-4 flex flex-wrap items-center gap-3">
        <h1 className="text-2xl font-semibold">Plan the trial</h1>
        <StatusBadge status={trial.status} />
      </div>
      <WizardNav trialId={trial.id} current={step} />
      <ReadOnlyNotice reason={reason} />
      {body}
    </section>
  );
}
