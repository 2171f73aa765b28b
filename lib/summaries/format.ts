import { measureIn, perHectareToPerAcre, tonnesPerHectareToPoundsPerAcre } from "@/lib/economics/units";

/** Whole percent, with a true minus sign; -0 reads as 0. */
export function percent(value: number): string {
  const rounded = Math.round(value);
  return `${rounded < 0 ? "−" : ""}${Math.abs(rounded)}%`;
}

/** A percent-control range for words: control cannot exceed 100%, so the top is capped there. */
export function percentRangeText(low: number, high: number): string {
  return `${percent(low)} to ${percent(Math.min(high, 100))}`;
}

export function money(value: number, currency: string): string {
  const rounded = Math.round(value);
  const text = Math.abs(rounded).toLocaleString("en-US");
  return `${rounded < 0 ? "−" : ""}${currency}${text}`;
}

export function number(value: number, digits = 1): string {
  const text = Math.abs(value).toLocaleString("en-US", { maximumFractionDigits: digits, minimumFractionDigits: 0 });
  return `${value < 0 && Number(text.replace(/,/g, "")) !== 0 ? "−" : ""}${text}`;
}

/** A yield in both systems: "2.4 t/ha (2,141 lb/acre)". */
export function yieldBoth(tonnesPerHa: number): string {
  return `${number(tonnesPerHa, 2)} t/ha (${number(tonnesPerHectareToPoundsPerAcre(tonnesPerHa), 0)} lb/acre)`;
}

/**
 * A weed density or biomass in both systems: "12 plants/m² (1.1 plants/ft²)". The text is
 * stored and read without the page's unit switch, so it carries both; a unit the units
 * module does not convert is given once.
 */
export function measureBoth(value: number, unit: string): string {
  const us = measureIn(value, unit, "us");
  const metricText = `${number(value, 1)} ${unit}`;
  if (us.unit === unit) return metricText;
  return `${metricText} (${number(us.value, us.value < 100 ? 1 : 0)} ${us.unit})`;
}

/** Money per area in both systems, acre first for growers who farm in acres. */
export function moneyPerAreaBoth(perHa: number, currency: string): string {
  return `${money(perHectareToPerAcre(perHa), currency)} per acre (${money(perHa, currency)} per hectare)`;
}

export function hoursPerAreaBoth(perHa: number): string {
  return `${number(perHectareToPerAcre(perHa), 1)} hours per acre (${number(perHa, 1)} per hectare)`;
}

export function list(items: string[]): string {
  if (items.length <= 1) return items.join("");
  return `${items.slice(0, -1).join(", ")} and ${items[items.length - 1]}`;
}
