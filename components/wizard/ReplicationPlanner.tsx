"use client";

import { useMemo, useState } from "react";
import { Button } from "@/components/ui/Button";
import { blocksNeeded, residualDfCheck } from "@/lib/stats";
import { blockWord, residualDf } from "@/lib/trials/labels";
import type { TrialDesign } from "@/lib/trials/vocabulary";

function parse(value: string): number {
  return value.trim() === "" ? Number.NaN : Number(value);
}

/**
 * How many blocks the trial needs to detect a difference worth acting on, from the statistics
 * engine's planning functions, and whether the chosen layout leaves 12 residual degrees of freedom.
 */
export function ReplicationPlanner({
  treatments,
  design,
  blocks,
  onUse,
  disabled,
}: {
  treatments: number;
  design: TrialDesign;
  blocks: number;
  onUse: (blocks: number) => void;
  disabled?: boolean;
}) {
  const [cv, setCv] = useState("20");
  const [difference, setDifference] = useState("30");
  const [kind, setKind] = useState<"percent" | "absolute">("percent");
  const [mean, setMean] = useState("");
  const [alpha, setAlpha] = useState("0.05");
  const [power, setPower] = useState("0.8");

  const result = useMemo(() => {
    if (treatments < 2) return { error: "Add at least two treatments to plan replication." } as const;
    try {
      const plan = blocksNeeded({
        treatments,
        cvPercent: parse(cv),
        difference: parse(difference),
        differenceKind: kind,
        mean: kind === "absolute" ? parse(mean) : undefined,
        alpha: parse(alpha),
        power: parse(power),
        maximumBlocks: 50,
      });
      return { plan } as const;
    } catch (error) {
      return { error: error instanceof Error ? error.message.replace(/^planning requires/, "The planner needs") : "Check the numbers." } as const;
    }
  }, [treatments, cv, difference, kind, mean, alpha, power]);

  const chosenDf = residualDfCheck(residualDf(design, treatments, blocks));
  const input = "w-full rounded border border-soil-200 px-2 py-1.5 text-base";

  return (
    <section aria-labelledby="planner-heading" className="rounded border border-soil-200 bg-white p-4">
      <h2 id="planner-heading" className="font-semibold">Replication planner</h2>
      <p className="mb-3 text-sm text-soil-700">
        How many blocks are needed to detect the difference you care about, for {treatments} treatments.
      </p>
      <div className="grid grid-cols-2 gap-3 text-sm">
        <label className="block">
          <span className="mb-1 block font-medium">Expected CV (%)</span>
          <input className={input} inputMode="decimal" value={cv} onChange={(event) => setCv(event.target.value)} />
        </label>
        <label className="block">
          <span className="mb-1 block font-medium">Difference worth detecting</span>
          <input className={input} inputMode="decimal" value={difference} onChange={(event) => setDifference(event.target.value)} />
        </label>
        <label className="block">
          <span className="mb-1 block font-medium">Difference given as</span>
          <select className={input} value={kind} onChange={(event) => setKind(event.target.value as "percent" | "absolute")}>
            <option value="percent">% of the trial mean</option>
            <option value="absolute">units of the response</option>
          </select>
        </label>
        {kind === "absolute" ? (
          <label className="block">
            <span className="mb-1 block font-medium">Expected trial mean</span>
            <input className={input} inputMode="decimal" value={mean} onChange={(event) => setMean(event.target.value)} />
          </label>
        ) : (
          <span />
        )}
        <label className="block">
          <span className="mb-1 block font-medium">Significance level (alpha)</span>
          <input className={input} inputMode="decimal" value={alpha} onChange={(event) => setAlpha(event.target.value)} />
        </label>
        <label className="block">
          <span className="mb-1 block font-medium">Power</span>
          <input className={input} inputMode="decimal" value={power} onChange={(event) => setPower(event.target.value)} />
        </label>
      </div>
      <div className="mt-4 space-y-2 text-sm" aria-live="polite">
        {"error" in result ? (
          <p className="text-red-700">{result.error}</p>
        ) : (
          <>
            <p data-testid="blocks-needed">
              <strong className="text-lg">{result.plan.blocks} blocks needed</strong> (power {result.plan.power.toFixed(2)}, {result.plan.dfResidual} residual df).
            </p>
            {!result.plan.residualDf.adequate && <p className="rounded bg-amber-50 px-2 py-1 text-amber-900">{result.plan.residualDf.message}</p>}
            {design !== "latin" && (
              <Button type="button" variant="secondary" className="disabled:cursor-not-allowed disabled:opacity-50" disabled={disabled || result.plan.blocks === blocks} onClick={() => onUse(result.plan.blocks)}>
                Use {result.plan.blocks} {blockWord(design)}
              </Button>
            )}
            {design !== "rcbd" && <p className="text-xs text-soil-700">Worked out for a randomized complete block design; treat it as a guide for this design.</p>}
          </>
        )}
        <p className={chosenDf.adequate ? "text-soil-700" : "rounded bg-amber-50 px-2 py-1 text-amber-900"} role={chosenDf.adequate ? undefined : "alert"} data-testid="residual-df">
          With {design === "latin" ? treatments : blocks} {blockWord(design)} as chosen: {chosenDf.message}
        </p>
      </div>
    </section>
  );
}
