"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { retryMail } from "./actions";

export function RetryButton({ id }: { id: string }) {
  const router = useRouter();
  const [pending, startTransition] = useTransition();
  const [error, setError] = useState<string | null>(null);
  return (
    <span>
      <button
        type="button"
        disabled={pending}
        className="rounded border border-soil-200 bg-white px-2 py-1 text-xs hover:bg-soil-100 disabled:text-soil-500"
        onClick={() =>
          startTransition(async () => {
            const result = await retryMail({ id });
            setError(result.ok ? null : result.error.message);
            router.refresh();
          })
        }
      >
        {pending ? "Retrying…" : "Retry now"}
      </button>
      {error && <span role="alert" className="ml-2 text-xs text-red-700">{error}</span>}
    </span>
  );
}
