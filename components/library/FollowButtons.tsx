"use client";

import { useState } from "react";
import { callApi } from "@/lib/client/api";
import { categoryNames } from "@/lib/trials/labels";
import type { MethodCategory } from "@/lib/trials/vocabulary";

interface FollowRecord {
  id: string;
  kind: "crop" | "method";
  value: string;
}

/** Follow this trial's crop or its methods, to hear when new trials are published. */
export function FollowButtons({ crop, categories, follows: initial }: { crop: string; categories: string[]; follows: FollowRecord[] }) {
  const [follows, setFollows] = useState(initial);
  const [message, setMessage] = useState<string | null>(null);
  const targets = [
    { kind: "crop" as const, value: crop.toLowerCase(), label: crop },
    ...categories.map((category) => ({ kind: "method" as const, value: category, label: categoryNames[category as MethodCategory] ?? category })),
  ];

  async function toggle(target: (typeof targets)[number]) {
    const existing = follows.find((follow) => follow.kind === target.kind && follow.value === target.value);
    if (existing) {
      const result = await callApi(`/api/follows/${existing.id}`, { method: "DELETE" });
      if (!result.ok) return setMessage(result.error.message);
      setFollows(follows.filter((follow) => follow.id !== existing.id));
      setMessage(`You no longer follow ${target.label}.`);
    } else {
      const result = await callApi<FollowRecord>("/api/follows", { method: "POST", json: { kind: target.kind, value: target.value } });
      if (!result.ok) return setMessage(result.error.message);
      setFollows([...follows, result.data]);
      setMessage(`You follow ${target.label}; we will tell you when new trials are published.`);
    }
  }

  return (
    <section aria-labelledby="follow-heading" className="rounded border border-soil-200 bg-white p-4 text-sm">
      <h2 id="follow-heading" className="mb-2 font-semibold">Hear about new trials</h2>
      <div className="flex flex-wrap gap-2">
        {targets.map((target) => {
          const following = follows.some((follow) => follow.kind === target.kind && follow.value === target.value);
          return (
            <button
              key={`${target.kind}-${target.value}`}
              type="button"
              aria-pressed={following}
              onClick={() => toggle(target)}
              className={`rounded border px-3 py-1.5 ${following ? "border-leaf-600 bg-leaf-600 text-white" : "border-soil-200 bg-white hover:bg-soil-100"}`}
            >
              {following ? `Following ${target.label}` : `Follow ${target.label}`}
            </button>
          );
        })}
      </div>
      <p className="mt-2 text-xs text-soil-700" role="status">
        {message ?? "Manage what you follow under Following."}
      </p>
    </section>
  );
}
