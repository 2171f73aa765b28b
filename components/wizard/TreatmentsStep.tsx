"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useFieldArray, useForm } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/Button";
import { callApi } from "@/lib/client/api";
import { categoryNames } from "@/lib/trials/labels";
import { trialTreatmentsSchema, type TreatmentInput, type TrialTreatmentsInput } from "@/lib/validations/trial";
import { checkTypes, methodCategories } from "@/lib/trials/vocabulary";
import { FormMessage, SelectField, TextAreaField, TextField } from "./fields";
import { errorAt, showServerErrors } from "./server-errors";

type Output = z.output<typeof trialTreatmentsSchema>;
interface CopySource {
  id: string;
  title: string;
  season: string;
  treatments: number;
}

const blank = (position: number): TreatmentInput => ({
  id: null,
  code: `T${position}`,
  name: "",
  category: "hand",
  checkType: "",
  description: "",
  timing: "",
  rateOrSettings: "",
  labourHoursPerHa: "",
  materialCostPerHa: "",
});

const checkOptions = [
  { value: "", label: "Not a check" },
  ...checkTypes.map((type) => ({ value: type, label: type === "weedy" ? "Weedy check (untreated)" : "Weed-free check" })),
];

export function TreatmentsStep({
  trialId,
  initial,
  copySources,
  readOnlyReason,
  hasLayout,
}: {
  trialId: string;
  initial: TreatmentInput[];
  copySources: CopySource[];
  readOnlyReason: string | null;
  hasLayout: boolean;
}) {
  const router = useRouter();
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);
  const [copyFrom, setCopyFrom] = useState(copySources[0]?.id ?? "");
  const { register, control, handleSubmit, setError, getValues, formState } = useForm<TrialTreatmentsInput, unknown, Output>({
    resolver: zodResolver(trialTreatmentsSchema),
    defaultValues: { treatments: initial.length > 0 ? initial : [blank(1)] },
  });
  const { fields, append, remove, move } = useFieldArray({ control, name: "treatments" });
  const errors = formState.errors;
  const disabled = Boolean(readOnlyReason);

  async function save(values: Output) {
    setMessage(null);
    const result = await callApi(`/api/trials/${trialId}/treatments`, { method: "PUT", json: values });
    if (!result.ok) {
      showServerErrors(result.error, setError);
      setMessage({ kind: "error", text: result.error.message });
      return;
    }
    router.push(`/trials/${trialId}/plan/design`);
    router.refresh();
  }

  async function copy() {
    setMessage(null);
    const result = await callApi<{ treatments: (TreatmentInput & { code: string })[] }>(`/api/trials/${copyFrom}/treatments`);
    if (!result.ok) {
      setMessage({ kind: "error", text: result.error.message });
      return;
    }
    const used = new Set(getValues("treatments").map((treatment) => String(treatment.code).toUpperCase()));
    const fresh = result.data.treatments.filter((treatment) => !used.has(treatment.code.toUpperCase()));
    // Replace a lone untouched starter row instead of keeping it.
    const current = getValues("treatments");
    if (current.length === 1 && !current[0].name) remove(0);
    append(
      fresh.map((treatment) => ({
        id: null,
        code: treatment.code,
        name: treatment.name,
        category: treatment.category,
        checkType: treatment.checkType ?? "",
        description: treatment.description ?? "",
        timing: treatment.timing ?? "",
        rateOrSettings: treatment.rateOrSettings ?? "",
        labourHoursPerHa: treatment.labourHoursPerHa ?? "",
        materialCostPerHa: treatment.materialCostPerHa ?? "",
      })),
    );
    const skipped = result.data.treatments.length - fresh.length;
    setMessage({ kind: "ok", text: `Copied ${fresh.length} treatments${skipped ? `; ${skipped} skipped because their codes are already used` : ""}. Save to keep them.` });
  }

  return (
    <form onSubmit={handleSubmit(save)} noValidate className="space-y-4" aria-label="Treatments">
      <FormMessage message={message} />
      {hasLayout && !disabled && (
        <p className="rounded border border-soil-200 bg-white px-3 py-2 text-sm text-soil-700">
          Saving lays the plots out again from the stored seed, so the map always matches the treatment list.
        </p>
      )}
      {errorAt(errors, "treatments") && (
        <p role="alert" className="text-sm text-red-700">
          {errorAt(errors, "treatments")}
        </p>
      )}
      {errorAt(errors, "treatments.root") && (
        <p role="alert" className="text-sm text-red-700">
          {errorAt(errors, "treatments.root")}
        </p>
      )}
      <fieldset disabled={disabled} className="space-y-4">
        <legend className="sr-only">Treatment list, in the order randomization draws from</legend>
        <ol className="space-y-4">
          {fields.map((field, index) => {
            const at = (name: string) => errorAt(errors, `treatments.${index}.${name}`);
            return (
              <li key={field.id} className="rounded border border-soil-200 bg-white p-4" data-testid="treatment-row">
                <div className="mb-3 flex flex-wrap items-center gap-2">
                  <h3 className="mr-auto font-semibold">Treatment {index + 1}</h3>
                  <Button type="button" variant="secondary" className="disabled:cursor-not-allowed disabled:opacity-50" onClick={() => move(index, index - 1)} disabled={index === 0} aria-label={`Move treatment ${index + 1} up`}>
                    ↑ Up
                  </Button>
                  <Button type="button" variant="secondary" className="disabled:cursor-not-allowed disabled:opacity-50" onClick={() => move(index, index + 1)} disabled={index === fields.length - 1} aria-label={`Move treatment ${index + 1} down`}>
                    ↓ Down
                  </Button>
                  <Button type="button" variant="secondary" className="disabled:cursor-not-allowed disabled:opacity-50" onClick={() => remove(index)} disabled={fields.length === 1} aria-label={`Remove treatment ${index + 1}`}>
                    Remove
                  </Button>
                </div>
                <input type="hidden" {...register(`treatments.${index}.id`)} />
                <div className="grid gap-3 sm:grid-cols-[8rem_1fr]">
                  <TextField label="Code" {...register(`treatments.${index}.code`)} error={at("code")} />
                  <TextField label="Name" {...register(`treatments.${index}.name`)} error={at("name")} placeholder="Hand hoeing" />
                </div>
                <div className="mt-3 grid gap-3 sm:grid-cols-2">
                  <SelectField
                    label="Method"
                    {...register(`treatments.${index}.category`)}
                    error={at("category")}
                    options={methodCategories.map((category) => ({ value: category, label: categoryNames[category] }))}
                  />
                  <SelectField label="Check" {...register(`treatments.${index}.checkType`)} error={at("checkType")} options={checkOptions} />
                  <TextField label="Timing" {...register(`treatments.${index}.timing`)} error={at("timing")} placeholder="14 and 28 days after planting" />
                  <TextField label="Rate or settings" {...register(`treatments.${index}.rateOrSettings`)} error={at("rateOrSettings")} placeholder="8 t/ha; 4 km/h" />
                  <TextField label="Labour (hours per ha)" inputMode="decimal" {...register(`treatments.${index}.labourHoursPerHa`)} error={at("labourHoursPerHa")} />
                  <TextField label="Material cost per ha" inputMode="decimal" {...register(`treatments.${index}.materialCostPerHa`)} error={at("materialCostPerHa")} />
                </div>
                <TextAreaField className="mt-3" label="Description" rows={2} {...register(`treatments.${index}.description`)} error={at("description")} />
              </li>
            );
          })}
        </ol>
        <div className="flex flex-wrap items-end gap-3">
          <Button type="button" variant="secondary" className="disabled:cursor-not-allowed disabled:opacity-50" onClick={() => append(blank(fields.length + 1))}>
            + Add a treatment
          </Button>
          {copySources.length > 0 && (
            <div className="flex flex-wrap items-end gap-2">
              <SelectField
                label="Copy treatments from"
                name="copyFrom"
                value={copyFrom}
                onChange={(event) => setCopyFrom(event.target.value)}
                options={copySources.map((source) => ({ value: source.id, label: `${source.title} (${source.season}, ${source.treatments})` }))}
                className="max-w-md"
              />
              <Button type="button" variant="secondary" className="disabled:cursor-not-allowed disabled:opacity-50" onClick={copy}>
                Copy
              </Button>
            </div>
          )}
        </div>
      </fieldset>
      <div className="flex flex-wrap gap-3 border-t border-soil-200 pt-4">
        <Button type="submit" disabled={formState.isSubmitting || disabled}>
          {formState.isSubmitting ? "Saving…" : "Save and continue"}
        </Button>
      </div>
    </form>
  );
}
