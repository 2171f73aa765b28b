"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/Button";
import { callApi } from "@/lib/client/api";
import { siteSchema, trialBasicsSchema, type SiteInput, type TrialBasics, type TrialBasicsInput } from "@/lib/validations/trial";
import { FormMessage, SelectField, TextAreaField, TextField } from "./fields";
import { errorAt, showServerErrors } from "./server-errors";

interface SiteOption {
  id: string;
  name: string;
  region: string;
}

export function BasicsStep({
  trialId,
  initial,
  sites: initialSites,
  readOnlyReason,
  pinnedNote = null,
  canAddSite,
}: {
  trialId: string | null;
  initial: TrialBasicsInput;
  sites: SiteOption[];
  readOnlyReason: string | null;
  /** Set once observations exist: crop, season and planting date stay as they are. */
  pinnedNote?: string | null;
  canAddSite: boolean;
}) {
  const router = useRouter();
  const [sites, setSites] = useState(initialSites);
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);
  const form = useForm<TrialBasicsInput, unknown, TrialBasics>({ resolver: zodResolver(trialBasicsSchema), defaultValues: initial });
  const { register, handleSubmit, setError, setValue, formState } = form;
  const errors = formState.errors;

  async function save(values: TrialBasics) {
    setMessage(null);
    const result = trialId
      ? await callApi<{ id: string }>(`/api/trials/${trialId}`, { method: "PATCH", json: values })
      : await callApi<{ id: string }>("/api/trials", { method: "POST", json: values });
    if (!result.ok) {
      showServerErrors(result.error, setError);
      setMessage({ kind: "error", text: result.error.message });
      return;
    }
    router.push(`/trials/${result.data.id}/plan/treatments`);
    router.refresh();
  }

  const disabled = Boolean(readOnlyReason);
  return (
    <div className="grid gap-6 lg:grid-cols-[2fr_1fr]">
      <form onSubmit={handleSubmit(save)} noValidate className="space-y-4 rounded border border-soil-200 bg-white p-4" aria-label="Trial basics">
        <FormMessage message={message} />
        <fieldset disabled={disabled} className="space-y-4">
          {pinnedNote && !disabled ? <p className="rounded border border-soil-200 bg-soil-50 p-2 text-sm text-soil-800">{pinnedNote}</p> : null}
          <TextField label="Trial title" {...register("title")} error={errorAt(errors, "title")} placeholder="Weed control in transplanted lettuce" />
          <div className="grid gap-4 sm:grid-cols-2">
            <TextField label="Crop" {...register("crop")} readOnly={Boolean(pinnedNote)} error={errorAt(errors, "crop")} placeholder="Lettuce" />
            <TextField label="Season" {...register("season")} readOnly={Boolean(pinnedNote)} error={errorAt(errors, "season")} inputMode="numeric" placeholder="2026" />
          </div>
          <SelectField
            label="Site"
            {...register("siteId")}
            error={errorAt(errors, "siteId")}
            options={[{ value: "", label: "Choose a site…" }, ...sites.map((site) => ({ value: site.id, label: `${site.name} (${site.region})` }))]}
          />
          <TextField label="Planting date" type="date" {...register("plantingDate")} readOnly={Boolean(pinnedNote)} error={errorAt(errors, "plantingDate")} hint="Assessments timed in days after planting are dated from it." />
          <TextAreaField label="Objective" {...register("objective")} error={errorAt(errors, "objective")} rows={4} placeholder="What the trial should find out, and for whom." />
        </fieldset>
        <div className="flex flex-wrap gap-3">
          <Button type="submit" disabled={formState.isSubmitting || disabled}>
            {formState.isSubmitting ? "Saving…" : trialId ? "Save and continue" : "Create draft and continue"}
          </Button>
        </div>
      </form>
      {canAddSite && !disabled && (
        <NewSiteForm
          onCreated={(site) => {
            setSites((current) => [...current, site].sort((a, b) => a.name.localeCompare(b.name)));
            setValue("siteId", site.id, { shouldValidate: true });
          }}
        />
      )}
    </div>
  );
}

function NewSiteForm({ onCreated }: { onCreated: (site: SiteOption) => void }) {
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);
  const { register, handleSubmit, setError, reset, formState } = useForm<SiteInput>({ resolver: zodResolver(siteSchema), defaultValues: { name: "", location: "", region: "", soil: "", notes: "" } });
  const errors = formState.errors;

  async function create(values: SiteInput) {
    const result = await callApi<SiteOption>("/api/sites", { method: "POST", json: values });
    if (!result.ok) {
      showServerErrors(result.error, setError);
      setMessage({ kind: "error", text: result.error.message });
      return;
    }
    reset();
    setMessage({ kind: "ok", text: `Added ${result.data.name}; it is chosen as the trial's site.` });
    onCreated(result.data);
  }

  return (
    <details className="h-fit rounded border border-soil-200 bg-white p-4">
      <summary className="cursor-pointer font-medium">Site not listed? Add a site</summary>
      <form onSubmit={handleSubmit(create)} noValidate className="mt-3 space-y-3" aria-label="New site">
        <FormMessage message={message} />
        <TextField label="Site name" {...register("name")} error={errorAt(errors, "name")} />
        <TextField label="Location on the site" {...register("location")} error={errorAt(errors, "location")} placeholder="Field 2, beds 1–12" />
        <TextField label="Region" {...register("region")} error={errorAt(errors, "region")} />
        <TextField label="Soil" {...register("soil")} error={errorAt(errors, "soil")} placeholder="Loam, 2% organic matter" />
        <TextAreaField label="Site notes" {...register("notes")} error={errorAt(errors, "notes")} rows={2} />
        <Button type="submit" variant="secondary" disabled={formState.isSubmitting} className="disabled:cursor-not-allowed disabled:opacity-50 w-full">
          {formState.isSubmitting ? "Adding…" : "Add site"}
        </Button>
      </form>
    </details>
  );
}
