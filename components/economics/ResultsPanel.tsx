"use client";

import { useMemo, useState } from "react";
import { methodEconomics } from "@/lib/economics/method-economics";
import { areaAmount, areaUnit, areaUnitShort, measureIn, pricePerKilogramToPerPound, pricePerPoundToPerKilogram, type UnitSystem } from "@/lib/economics/units";
import { money, number, percent, percentRangeText } from "@/lib/summaries/format";
import type { SummaryNumbers } from "@/lib/summaries/numbers";
import { BarChart } from "./BarChart";

/**
 * The grower's view of the numbers: weeds left and cost per method as charts, the cost
 * breakdown, and a partial budget against no weeding, under a labour rate and crop price the
 * reader can change, in metric or US customary units.
 */
export function ResultsPanel({ numbers }: { numbers: SummaryNumbers }) {
  const [system, setSystem] = useState<UnitSystem>("us");
  const [labourRate, setLabourRate] = useState(String(numbers.defaults.labourRatePerHour));
  const [price, setPrice] = useState(String(pricePerKilogramToPerPound(numbers.defaults.cropPricePerKg).toFixed(2)));
  const currency = numbers.input.currency;
  const labourRatePerHour = Number(labourRate) >= 0 && labourRate.trim() !== "" ? Number(labourRate) : numbers.defaults.labourRatePerHour;
  const priceValue = Number(price) >= 0 && price.trim() !== "" ? Number(price) : 0;
  const cropPricePerKg = system === "metric" ? priceValue : pricePerPoundToPerKilogram(priceValue);
  const rows = useMemo(() => methodEconomics(numbers, { labourRatePerHour, cropPricePerKg }), [numbers, labourRatePerHour, cropPricePerKg]);

  function switchUnits(next: UnitSystem) {
    if (next === system) return;
    // Keep the same price, expressed per kg or per lb.
    const perKg = system === "metric" ? priceValue : pricePerPoundToPerKilogram(priceValue);
    setPrice((next === "metric" ? perKg : pricePerKilogramToPerPound(perKg)).toFixed(2));
    setSystem(next);
  }

  const area = areaUnit(system);
  const perArea = (perHa: number) => money(areaAmount(perHa, system), currency);
  const weeds = numbers.input.weeds;
  const methods = rows.filter((row) => row.checkType === null);
  const weightUnit = system === "metric" ? "kg" : "lb";

  return (
    <section aria-labelledby="numbers-heading" className="space-y-4">
      <div className="flex flex-wrap items-end gap-4 rounded border border-soil-200 bg-white p-4">
        <h2 id="numbers-heading" className="w-full text-lg font-semibold">Weeds and money, per method</h2>
        <fieldset className="flex gap-3 text-sm">
          <legend className="mb-1 text-sm font-medium">Units</legend>
          {(["us", "metric"] as const).map((option) => (
            <label key={option} className="flex items-center gap-1">
              <input type="radio" name="units" value={option} checked={system === option} onChange={() => switchUnits(option)} />
              {option === "us" ? "Acres, pounds" : "Hectares, kilograms"}
            </label>
          ))}
        </fieldset>
        <label className="text-sm">
          <span className="mb-1 block font-medium">Labour ({currency} per hour)</span>
          <input className="w-28 rounded border border-soil-200 px-2 py-1" inputMode="decimal" value={labourRate} onChange={(event) => setLabourRate(event.target.value)} />
        </label>
        <label className="text-sm">
          <span className="mb-1 block font-medium">
            Crop price ({currency} per {weightUnit})
          </span>
          <input className="w-28 rounded border border-soil-200 px-2 py-1" inputMode="decimal" value={price} onChange={(event) => setPrice(event.target.value)} />
        </label>
        <p className="w-full text-xs text-soil-700">
          Defaults: labour {money(numbers.defaults.labourRatePerHour, currency)} an hour and a crop price of {currency}
          {numbers.defaults.cropPricePerKg.toFixed(2)} per kg are invented demo assumptions, not market data. Put in your own.
        </p>
      </div>

      <div className="grid gap-4 lg:grid-cols-2">
        {weeds && (
          <BarChart
            testId="weeds-chart"
            title="Weeds left per method"
            caption={`${weeds.measure === "weed-density" ? "Weeds counted" : "Weed dry weight"}${weeds.daysAfterPlanting !== null ? ` ${weeds.daysAfterPlanting} days after planting` : ""}; shorter is better.`}
            bars={rows
              .filter((row) => row.weedsLeft !== null)
              .map((row) => {
                const shown = measureIn(row.weedsLeft!, weeds.unit, system);
                return {
                  key: row.code,
                  label: row.name,
                  value: row.weedsLeft!,
                  valueText: `${number(shown.value, shown.value < 10 ? 1 : 0)} ${shown.unit}`,
                  note: row.percentControl !== null ? `${percent(row.percentControl)} control` : undefined,
                  tone: row.checkType ? "check" : "method",
                };
              })}
          />
        )}
        <BarChart
          testId="cost-chart"
          title={`Weeding cost per ${area}`}
          caption={`Labour, materials and equipment for the season, at ${money(labourRatePerHour, currency)} an hour.`}
          bars={rows
            .filter((row) => row.checkType !== "weedy")
            .map((row) => ({ key: row.code, label: row.name, value: row.cost.totalPerHa, valueText: `${perArea(row.cost.totalPerHa)} per ${areaUnitShort(system)}`, tone: row.checkType ? "check" : "method" }))}
        />
      </div>

      <div className="overflow-x-auto rounded border border-soil-200 bg-white">
        <table className="w-full min-w-[44rem] text-sm" data-testid="cost-table">
          <caption className="px-3 pt-3 text-left font-semibold">Cost per {area}, by method</caption>
          <thead className="text-left text-soil-700">
            <tr>
              <th className="px-3 py-2">Method</th>
              <th className="px-3 py-2 text-right">Passes</th>
              <th className="px-3 py-2 text-right">Labour hours</th>
              <th className="px-3 py-2 text-right">Labour</th>
              <th className="px-3 py-2 text-right">Materials</th>
              <th className="px-3 py-2 text-right">Equipment</th>
              <th className="px-3 py-2 text-right">Total</th>
              <th className="px-3 py-2 text-right">Per % of weed control</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((row) => (
              <tr key={row.code} className="border-t border-soil-200">
                <th scope="row" className="px-3 py-2 text-left font-medium">
                  {row.name}
                  {row.cost.missing.length > 0 && <span className="block text-xs font-normal text-soil-700">Not recorded: {row.cost.missing.join(", ")}</span>}
                </th>
                <td className="px-3 py-2 text-right tabular-nums">{row.cost.passes}</td>
                <td className="px-3 py-2 text-right tabular-nums">{number(areaAmount(row.cost.labourHoursPerHa, system), 1)}</td>
                <td className="px-3 py-2 text-right tabular-nums">{perArea(row.cost.labourCostPerHa)}</td>
                <td className="px-3 py-2 text-right tabular-nums">{perArea(row.cost.materialCostPerHa)}</td>
                <td className="px-3 py-2 text-right tabular-nums">{perArea(row.cost.equipmentCostPerHa)}</td>
                <td className="px-3 py-2 text-right font-medium tabular-nums">{perArea(row.cost.totalPerHa)}</td>
                <td className="px-3 py-2 text-right tabular-nums">
                  {row.costPerPercentControl !== null && !(row.cost.missing.length > 0 && row.cost.totalPerHa === 0) ? `${currency}${number(areaAmount(row.costPerPercentControl, system), 2)}` : "—"}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        <p className="px-3 pb-3 text-xs text-soil-700">Equipment is its price spread over its useful life and the area it works each year. Weed control is against the weedy check{weeds ? ` (${weeds.assessmentName.toLowerCase()})` : ""}.</p>
      </div>

      {methods.some((row) => row.budget) && (
        <div className="overflow-x-auto rounded border border-soil-200 bg-white">
          <table className="w-full min-w-[40rem] text-sm" data-testid="budget-table">
            <caption className="px-3 pt-3 text-left font-semibold">Partial budget against no weeding, per {area}</caption>
            <thead className="text-left text-soil-700">
              <tr>
                <th className="px-3 py-2">Method</th>
                <th className="px-3 py-2 text-right">Extra yield</th>
                <th className="px-3 py-2 text-right">Extra income</th>
                <th className="px-3 py-2 text-right">Extra cost</th>
                <th className="px-3 py-2 text-right">Net change</th>
                <th className="px-3 py-2 text-right">Range of net change</th>
              </tr>
            </thead>
            <tbody>
              {methods
                .filter((row) => row.budget)
                .map((row) => {
                  const budget = row.budget!;
                  const extra = measureIn(budget.yieldDifferenceTonnesPerHa, "t/ha", system);
                  return (
                    <tr key={row.code} className="border-t border-soil-200">
                      <th scope="row" className="px-3 py-2 text-left font-medium">{row.name}</th>
                      <td className="px-3 py-2 text-right tabular-nums">{`${number(extra.value, system === "metric" ? 2 : 0)} ${extra.unit}`}</td>
                      <td className="px-3 py-2 text-right tabular-nums">{perArea(budget.addedReturnsPerHa)}</td>
                      <td className="px-3 py-2 text-right tabular-nums">{perArea(budget.addedCostsPerHa)}</td>
                      <td className={`px-3 py-2 text-right font-medium tabular-nums ${budget.netChangePerHa < 0 ? "text-red-800" : ""}`}>{perArea(budget.netChangePerHa)}</td>
                      <td className="px-3 py-2 text-right tabular-nums">
                        {budget.netChangeRange ? `${perArea(budget.netChangeRange.low)} to ${perArea(budget.netChangeRange.high)}` : "—"}
                      </td>
                    </tr>
                  );
                })}
            </tbody>
          </table>
          <p className="px-3 pb-3 text-xs text-soil-700">
            Extra yield is this trial&apos;s yield over the weedy check, valued at your crop price; extra cost is the weeding cost above. The range follows the 95% range of the extra yield.
            Harvest, packing and selling costs of the extra crop are not included.
          </p>
        </div>
      )}

      {weeds && (
        <details className="rounded border border-soil-200 bg-white p-3 text-sm">
          <summary className="cursor-pointer font-medium">Weed control ranges</summary>
          <ul className="mt-2 space-y-1">
            {methods
              .filter((row) => row.percentControl !== null)
              .map((row) => (
                <li key={row.code}>
                  {row.name}: {percent(row.percentControl!)}
                  {row.percentRange ? ` (range ${percentRangeText(row.percentRange.low, row.percentRange.high)})` : ""}
                </li>
              ))}
          </ul>
          <p className="mt-2 text-xs text-soil-700">
            95% confidence ranges from the difference against the weedy check, taking the check&apos;s average as known; the true range is a little wider.
          </p>
        </details>
      )}
    </section>
  );
}
