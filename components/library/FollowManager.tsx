"use client";

import { useState } from "react";
import { Button } from "@/components/ui/Button";
import { callApi } from "@/lib/client/api";
import { categoryNames } from "@/lib/trials/labels";
import type { MethodCategory } from "@/lib/trials/vocabulary";
import { libraryMethods } from "@/lib/validations/library";

interface FollowRecord {
  id: string;
  kind: "crop" | "method";
  value: string;
}

const label = (follow: Pick<FollowRecord, "kind" | "value">) =>
  follow.kind === "method" ? `Method: ${categoryNames[follow.value as MethodCategory] ?? follow.value}` : `Crop: ${follow.value[0]?.toUpperCase()}${follow.value.slice(1)}`;

export function FollowManager({ follows: initial, crops }: { follows: FollowRecord[]; crops: string[] }) {
  const [follows, setFollows] = useState(initial);
  const [crop, setCrop] = useState("");
  const [method, setMethod] = useState("");
  const [message, setMessage] = useState<string | null>(null);

  async function add(kind: "crop" | "method", value: string) {
    if (!value.trim()) return;
    const result = await callApi<FollowRecord>("/api/follows", { method: "POST", json: { kind, value } });
    if (!result.ok) return setMessage(result.error.fields?.[0]?.message ?? result.error.message);
    if (!follows.some((follow) => follow.id === result.data.id)) setFollows([...follows, result.data]);
    setMessage(`Following ${label(result.data).toLowerCase()}.`);
    setCrop("");
    setMethod("");
  }

  async function remove(follow: FollowRecord) {
    const result = await callApi(`/api/follows/${follow.id}`, { method: "DELETE" });
    if (!result.ok) return setMessage(result.error.message);
    setFollows(follows.filter((item) => item.id !== follow.id));
    setMessage(`Stopped following ${label(follow).toLowerCase()}.`);
  }

  return (
    <div className="grid gap-6 md:grid-cols-2">
      <section aria-labelledby="current-heading" className="rounded border border-soil-200 bg-white p-4">
        <h2 id="current-heading" className="mb-2 font-semibold">What you follow</h2>
        {follows.length === 0 ? (
          <p className="text-sm text-soil-700">Nothing yet.</p>
        ) : (
          <ul className="space-y-2">
            {follows.map((follow) => (
              <li key={follow.id} className="flex items-center gap-3" data-testid="follow-row">
                <span className="mr-auto">{label(follow)}</span>
                <Button type="button" variant="secondary" onClick={() => remove(follow)}>
                  Stop following
                </Button>
              </li>
            ))}
          </ul>
        )}
      </section>
      <section aria-labelledby="add-heading" className="space-y-4 rounded border border-soil-200 bg-white p-4">
        <h2 id="add-heading" className="font-semibold">Follow more</h2>
        <form className="flex flex-wrap items-end gap-2" onSubmit={(event) => { event.preventDefault(); void add("crop", crop); }}>
          <label className="text-sm">
            <span className="mb-1 block font-medium">Crop</span>
            <input list="library-crops" value={crop} onChange={(event) => setCrop(event.target.value)} className="rounded border border-soil-200 px-2 py-1.5" />
            <datalist id="library-crops">{crops.map((name) => <option key={name} value={name} />)}</datalist>
          </label>
          <Button type="submit">Follow crop</Button>
        </form>
        <form className="flex flex-wrap items-end gap-2" onSubmit={(event) => { event.preventDefault(); void add("method", method); }}>
          <label className="text-sm">
            <span className="mb-1 block font-medium">Method</span>
            <select value={method} onChange={(event) => setMethod(event.target.value)} className="rounded border border-soil-200 bg-white px-2 py-1.5">
              <option value="">Choose…</option>
              {libraryMethods.map((category) => <option key={category} value={category}>{categoryNames[category]}</option>)}
            </select>
          </label>
          <Button type="submit">Follow method</Button>
        </form>
        <p role="status" className="text-sm text-soil-700">{message}</p>
      </section>
    </div>
  );
}
