"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import { Button } from "@/components/ui/Button";
import { callApi } from "@/lib/client/api";
import { blockWord, designNames } from "@/lib/trials/labels";
import { trialDesignSchema, type TrialDesignInput, type TrialDesignValues } from "@/lib/validations/trial";
import { trialDesigns, type TrialDesign } from "@/lib/trials/vocabulary";
import { FormMessage, SelectField, TextField } from "./fields";
import { ReplicationPlanner } from "./ReplicationPlanner";
import { errorAt, showServerErrors } from "./server-errors";

export function DesignStep({
  trialId,
  initial,
  treatmentCount,
  plotCount,
  readOnlyReason,
  canRandomize,
}: {
  trialId: string;
  initial: TrialDesignValues;
  treatmentCount: number;
  plotCount: number;
  readOnlyReason: string | null;
  canRandomize: boolean;
}) {
  const router = useRouter();
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  const { register, control, handleSubmit, setError, setValue, formState } = useForm<TrialDesignInput, unknown, TrialDesignValues>({
    resolver: zodResolver(trialDesignSchema),
    defaultValues: initial,
  });
  const design = useWatch({ control, name: "design" }) as TrialDesign;
  const blocks = Number(useWatch({ control, name: "blocks" }));
  const errors = formState.errors;
  const disabled = Boolean(readOnlyReason);

  useEffect(() => {
    if (design === "latin" && treatmentCount >= 2) setValue("blocks", treatmentCount);
  }, [design, treatmentCount, setValue]);

  async function save(values: TrialDesignValues) {
    setMessage(null);
    const result = await callApi<{ plots: number }>(`/api/trials/${trialId}/design`, { method: "PUT", json: values });
    if (!result.ok) {
      showServerErrors(result.error, setError);
      setMessage({ kind: "error", text: result.error.message });
      return;
    }
    router.push(`/trials/${trialId}/plan/assessments`);
    router.refresh();
  }

  async function rerandomize() {
    setBusy(true);
    setMessage(null);
    const result = await callApi<{ seed: number; plots: number }>(`/api/trials/${trialId}/randomize`, { method: "POST", json: { newSeed: true } });
    setBusy(false);
    if (!result.ok) {
      setMessage({ kind: "error", text: result.error.message });
      return;
    }
    setValue("randomSeed", result.data.seed);
    setMessage({ kind: "ok", text: `Re-randomized with the new seed ${result.data.seed}: ${result.data.plots} plots laid out.` });
    router.refresh();
  }

  return (
    <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
      <form onSubmit={handleSubmit(save)} noValidate className="space-y-4 rounded border border-soil-200 bg-white p-4" aria-label="Design and plots">
        <FormMessage message={message} />
        <fieldset disabled={disabled} className="space-y-4">
          <SelectField label="Design" {...register("design")} error={errorAt(errors, "design")} options={trialDesigns.map((value) => ({ value, label: designNames[value] }))} />
          <TextField
            label={`Number of ${blockWord(design)}`}
            inputMode="numeric"
            {...register("blocks")}
            readOnly={design === "latin"}
            error={errorAt(errors, "blocks")}
            hint={design === "latin" ? `A Latin square has as many rows and columns as treatments (${treatmentCount}).` : undefined}
          />
          <div className="grid gap-4 sm:grid-cols-2">
            <TextField label="Plot length (m)" inputMode="decimal" {...register("plotLengthM")} error={errorAt(errors, "plotLengthM")} />
            <TextField label="Plot width (m)" inputMode="decimal" {...register("plotWidthM")} error={errorAt(errors, "plotWidthM")} />
            <TextField label="Harvest area (m²)" inputMode="decimal" {...register("harvestAreaM2")} error={errorAt(errors, "harvestAreaM2")} />
            <TextField label="Quadrat area (m²)" inputMode="decimal" {...register("quadratAreaM2")} error={errorAt(errors, "quadratAreaM2")} />
          </div>
          <label className="flex items-start gap-2 text-sm">
            <input type="checkbox" {...register("serpentine")} className="mt-1 h-4 w-4" />
            <span>
              <span className="font-medium">Serpentine plot numbering</span>
              <span className="block text-soil-700">Every second row is numbered back the other way, so the walk through the field snakes.</span>
            </span>
          </label>
          <TextField
            label="Random seed"
            inputMode="numeric"
            {...register("randomSeed")}
            error={errorAt(errors, "randomSeed")}
            hint="The layout is drawn from this number; the same seed always gives the same layout."
          />
        </fieldset>
        <p className="text-sm text-soil-700" data-testid="layout-state">
          {plotCount > 0 ? `${plotCount} plots are laid out.` : "No plots are laid out yet; saving lays them out from the seed."}
        </p>
        <div className="flex flex-wrap gap-3">
          <Button type="submit" disabled={formState.isSubmitting || disabled}>
            {formState.isSubmitting ? "Saving…" : "Save, lay out plots and continue"}
          </Button>
          {canRandomize && plotCount > 0 && (
            <Button type="button" variant="secondary" className="disabled:cursor-not-allowed disabled:opacity-50" onClick={rerandomize} disabled={busy}>
              {busy ? "Randomizing…" : "Re-randomize with a new seed"}
            </Button>
          )}
        </div>
      </form>
      <ReplicationPlanner treatments={treatmentCount} design={design} blocks={blocks} disabled={disabled} onUse={(value) => setValue("blocks", value, { shouldValidate: true })} />
    </div>
  );
}
