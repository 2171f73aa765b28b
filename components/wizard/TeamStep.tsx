"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useFieldArray, useForm } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/Button";
import { callApi } from "@/lib/client/api";
import { trialTeamSchema, type TrialTeamInput } from "@/lib/validations/trial";
import { FormMessage } from "./fields";
import { errorAt, showServerErrors } from "./server-errors";

type Output = z.output<typeof trialTeamSchema>;
interface Person {
  userId: string;
  name: string;
  email: string;
  role: "technician" | "reviewer";
}

export function TeamStep({ trialId, initial, candidates, readOnlyReason }: { trialId: string; initial: Person[]; candidates: Person[]; readOnlyReason: string | null }) {
  const router = useRouter();
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);
  const [pick, setPick] = useState("");
  const { control, handleSubmit, setError, formState } = useForm<TrialTeamInput, unknown, Output>({
    resolver: zodResolver(trialTeamSchema),
    defaultValues: { members: initial.map(({ userId, role }) => ({ userId, role })) },
  });
  const { fields, append, remove } = useFieldArray({ control, name: "members" });
  const errors = formState.errors;
  const disabled = Boolean(readOnlyReason);
  const byId = new Map(candidates.concat(initial).map((person) => [person.userId, person]));
  const available = candidates.filter((person) => !fields.some((field) => field.userId === person.userId));

  async function save(values: Output) {
    setMessage(null);
    const result = await callApi(`/api/trials/${trialId}/team`, { method: "PUT", json: values });
    if (!result.ok) {
      showServerErrors(result.error, setError);
      setMessage({ kind: "error", text: result.error.message });
      return;
    }
    router.push(`/trials/${trialId}`);
    router.refresh();
  }

  function add() {
    const person = byId.get(pick);
    if (!person) return;
    append({ userId: person.userId, role: person.role });
    setPick("");
  }

  return (
    <form onSubmit={handleSubmit(save)} noValidate className="max-w-2xl space-y-4 rounded border border-soil-200 bg-white p-4" aria-label="Team">
      <FormMessage message={message} />
      <p className="text-sm text-soil-700">Technicians collect the data; reviewers read the analysis and sign it off. You own the trial and need no place on the list.</p>
      <fieldset disabled={disabled} className="space-y-4">
        <legend className="sr-only">Team members</legend>
        {fields.length === 0 ? (
          <p className="text-soil-700">Nobody is on the team yet.</p>
        ) : (
          <ul className="divide-y divide-soil-100 rounded border border-soil-200">
            {fields.map((field, index) => {
              const person = byId.get(field.userId);
              const error = errorAt(errors, `members.${index}.userId`) ?? errorAt(errors, `members.${index}.role`);
              return (
                <li key={field.id} className="flex flex-wrap items-center gap-3 p-3" data-testid="team-row">
                  <div className="flex-1">
                    <p className="font-medium">{person?.name ?? "Unknown person"}</p>
                    <p className="text-sm text-soil-700">
                      {field.role === "technician" ? "Technician" : "Reviewer"} · {person?.email}
                    </p>
                    {error && (
                      <p role="alert" className="text-sm text-red-700">
                        {error}
                      </p>
                    )}
                  </div>
                  <Button type="button" variant="secondary" className="disabled:cursor-not-allowed disabled:opacity-50" onClick={() => remove(index)} aria-label={`Remove ${person?.name ?? "member"}`}>
                    Remove
                  </Button>
                </li>
              );
            })}
          </ul>
        )}
        <div className="flex flex-wrap items-end gap-2">
          <label className="block flex-1 text-sm">
            <span className="mb-1 block font-medium">Add a technician or reviewer</span>
            <select value={pick} onChange={(event) => setPick(event.target.value)} className="w-full rounded border border-soil-200 bg-white px-3 py-2 text-base">
              <option value="">Choose a person…</option>
              {available.map((person) => (
                <option key={person.userId} value={person.userId}>
                  {person.name} ({person.role === "technician" ? "technician" : "reviewer"})
                </option>
              ))}
            </select>
          </label>
          <Button type="button" variant="secondary" className="disabled:cursor-not-allowed disabled:opacity-50" onClick={add} disabled={!pick}>
            + Add to team
          </Button>
        </div>
      </fieldset>
      <div className="flex flex-wrap gap-3 border-t border-soil-200 pt-4">
        <Button type="submit" disabled={formState.isSubmitting || disabled}>
          {formState.isSubmitting ? "Saving…" : "Save team and finish"}
        </Button>
      </div>
    </form>
  );
}
