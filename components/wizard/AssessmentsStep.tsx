"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useFieldArray, useForm } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/Button";
import { callApi } from "@/lib/client/api";
import { defaultUnits, variableNames } from "@/lib/trials/labels";
import { trialAssessmentsSchema, type AssessmentInput, type TrialAssessmentsInput } from "@/lib/validations/trial";
import { assessmentVariables, type AssessmentVariable } from "@/lib/trials/vocabulary";
import { FormMessage, SelectField, TextAreaField, TextField } from "./fields";
import { errorAt, showServerErrors } from "./server-errors";

type Output = z.output<typeof trialAssessmentsSchema>;

function preset(variable: AssessmentVariable, quadrats: number): AssessmentInput {
  const perQuadrat = variable === "weed-density" || variable === "weed-biomass";
  return {
    id: null,
    name: variable === "custom" ? "" : variableNames[variable],
    variable,
    unit: defaultUnits[variable],
    plannedDate: "",
    timingDays: "",
    timingReference: "planting",
    quadratsPerPlot: perQuadrat ? quadrats : 1,
    notes: "",
  };
}

const referenceOptions = [
  { value: "", label: "No fixed timing" },
  { value: "planting", label: "after planting" },
  { value: "treatment", label: "after treatment" },
];

export function AssessmentsStep({
  trialId,
  initial,
  pinned,
  readOnlyReason,
}: {
  trialId: string;
  initial: AssessmentInput[];
  /** Ids of assessments with observations: their measure, unit and quadrats are fixed. */
  pinned: string[];
  readOnlyReason: string | null;
}) {
  const router = useRouter();
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);
  const [nextVariable, setNextVariable] = useState<AssessmentVariable>("weed-density");
  const { register, control, handleSubmit, setError, setValue, getValues, formState } = useForm<TrialAssessmentsInput, unknown, Output>({
    resolver: zodResolver(trialAssessmentsSchema),
    defaultValues: { assessments: initial },
  });
  const { fields, append, remove, move } = useFieldArray({ control, name: "assessments" });
  const errors = formState.errors;
  const disabled = Boolean(readOnlyReason);

  async function save(values: Output) {
    setMessage(null);
    const result = await callApi(`/api/trials/${trialId}/assessments`, { method: "PUT", json: values });
    if (!result.ok) {
      showServerErrors(result.error, setError);
      setMessage({ kind: "error", text: result.error.message });
      return;
    }
    router.push(`/trials/${trialId}/plan/team`);
    router.refresh();
  }

  return (
    <form onSubmit={handleSubmit(save)} noValidate className="space-y-4" aria-label="Assessments">
      <FormMessage message={message} />
      <fieldset disabled={disabled} className="space-y-4">
        <legend className="sr-only">Planned assessments</legend>
        {fields.length === 0 && <p className="rounded border border-dashed border-soil-200 bg-white p-4 text-soil-700">No assessments planned yet. Add what will be counted, weighed or rated, and when.</p>}
        <ol className="space-y-4">
          {fields.map((field, index) => {
            const at = (name: string) => errorAt(errors, `assessments.${index}.${name}`);
            const id = getValues(`assessments.${index}.id`) as string | null | undefined;
            const isPinned = Boolean(id && pinned.includes(id));
            return (
              <li key={field.id} className="rounded border border-soil-200 bg-white p-4" data-testid="assessment-row">
                <div className="mb-3 flex flex-wrap items-center gap-2">
                  <h3 className="mr-auto font-semibold">Assessment {index + 1}</h3>
                  <Button type="button" variant="secondary" className="disabled:cursor-not-allowed disabled:opacity-50" onClick={() => move(index, index - 1)} disabled={index === 0} aria-label={`Move assessment ${index + 1} up`}>
                    ↑ Up
                  </Button>
                  <Button type="button" variant="secondary" className="disabled:cursor-not-allowed disabled:opacity-50" onClick={() => move(index, index + 1)} disabled={index === fields.length - 1} aria-label={`Move assessment ${index + 1} down`}>
                    ↓ Down
                  </Button>
                  <Button type="button" variant="secondary" className="disabled:cursor-not-allowed disabled:opacity-50" onClick={() => remove(index)} disabled={isPinned} aria-label={`Remove assessment ${index + 1}`}>
                    Remove
                  </Button>
                </div>
                {isPinned && <p className="mb-2 text-sm text-soil-700">Observations are recorded for this assessment: what it measures, its unit and quadrats stay as they are.</p>}
                <input type="hidden" {...register(`assessments.${index}.id`)} />
                <div className="grid gap-3 sm:grid-cols-2">
                  <TextField label="Name" {...register(`assessments.${index}.name`)} error={at("name")} />
                  <SelectField
                    label="What is measured"
                    {...register(`assessments.${index}.variable`, {
                      onChange: (event) => {
                        const variable = event.target.value as AssessmentVariable;
                        setValue(`assessments.${index}.unit`, defaultUnits[variable]);
                      },
                    })}
                    disabled={isPinned}
                    error={at("variable")}
                    options={assessmentVariables.map((variable) => ({ value: variable, label: variableNames[variable] }))}
                  />
                  <TextField label="Unit" {...register(`assessments.${index}.unit`)} readOnly={isPinned} error={at("unit")} />
                  <TextField label="Quadrats per plot" inputMode="numeric" {...register(`assessments.${index}.quadratsPerPlot`)} readOnly={isPinned} error={at("quadratsPerPlot")} />
                  <div className="grid grid-cols-[6rem_1fr] gap-2">
                    <TextField label="Days" inputMode="numeric" {...register(`assessments.${index}.timingDays`)} error={at("timingDays")} />
                    <SelectField label="Counted from" {...register(`assessments.${index}.timingReference`)} error={at("timingReference")} options={referenceOptions} />
                  </div>
                  <TextField label="Planned date" type="date" {...register(`assessments.${index}.plannedDate`)} error={at("plannedDate")} hint="Optional; otherwise dated from the planting date." />
                </div>
                <TextAreaField className="mt-3" label="Instructions for the field" rows={2} {...register(`assessments.${index}.notes`)} error={at("notes")} />
              </li>
            );
          })}
        </ol>
        <div className="flex flex-wrap items-end gap-2">
          <SelectField
            label="Add an assessment of"
            name="nextVariable"
            value={nextVariable}
            onChange={(event) => setNextVariable(event.target.value as AssessmentVariable)}
            options={assessmentVariables.map((variable) => ({ value: variable, label: variableNames[variable] }))}
            className="max-w-xs"
          />
          <Button type="button" variant="secondary" className="disabled:cursor-not-allowed disabled:opacity-50" onClick={() => append(preset(nextVariable, 4))}>
            + Add
          </Button>
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
