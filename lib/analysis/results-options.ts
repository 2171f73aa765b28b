import { transforms } from "@/lib/validations/analysis";

/** The results page's option controls, as the strings its form holds. */
export interface ResultsOptionsState {
  transform: (typeof transforms)[number];
  method: "lsd" | "tukey";
  alpha: string;
  control: string;
  reference: string;
  margin: string;
}

export const alphaChoices = ["0.01", "0.05", "0.1"] as const;

type Query = Record<string, string | string[] | undefined>;
const single = (value: string | string[] | undefined) => (typeof value === "string" ? value : undefined);

/**
 * Options from the page address (so a reload or a shared link shows the same analysis), each
 * kept only when the form could have produced it; anything else falls back to the default.
 */
export function resultsOptionsFrom(query: Query, defaults: ResultsOptionsState, treatmentCodes: readonly string[]): ResultsOptionsState {
  const transform = single(query.transform);
  const method = single(query.method);
  const alpha = single(query.alpha);
  const control = single(query.control);
  const reference = single(query.reference);
  const margin = single(query.margin);
  const knownCode = (code: string | undefined) => code !== undefined && (code === "" || treatmentCodes.includes(code));
  const options: ResultsOptionsState = {
    transform: transforms.includes(transform as ResultsOptionsState["transform"]) ? (transform as ResultsOptionsState["transform"]) : defaults.transform,
    method: method === "lsd" || method === "tukey" ? method : defaults.method,
    alpha: alphaChoices.includes(alpha as (typeof alphaChoices)[number]) ? alpha! : defaults.alpha,
    control: knownCode(control) ? control! : defaults.control,
    reference: knownCode(reference) ? reference! : defaults.reference,
    margin: margin !== undefined && Number.isFinite(Number(margin)) && Number(margin) > 0 ? margin : defaults.margin,
  };
  return options.reference ? options : { ...options, margin: "" };
}

/** The query string for the analysis API and the page address alike. */
export function resultsQueryOf(options: ResultsOptionsState): string {
  const query = new URLSearchParams({ transform: options.transform, method: options.method, alpha: options.alpha });
  if (options.control) query.set("control", options.control);
  if (options.reference && Number(options.margin) > 0) {
    query.set("reference", options.reference);
    query.set("margin", options.margin);
  }
  return query.toString();
}
