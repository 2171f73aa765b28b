import { StatsInputError } from "../errors";

/** Response values shifted by a common integer offset, value = offset + centred. */
export interface CentredValues {
  offset: number;
  centred: Float64Array;
}

const plainDecimal = /^([+-]?)(\d*)(?:\.(\d*))?$/;

/**
 * Subtracts a common integer offset from every value *before* rounding to
 * double precision.
 *
 * Why: "1000000000000.4" has no exact double; rounding it first leaves an
 * error of about 1e-4 in the 0.4 that matters, so sums of squares of data
 * near 1e12 (NIST StRD SmLs09) would be wrong from the fifth digit on. Doing
 * the subtraction exactly on the decimal string (BigInt integer part plus
 * the fraction digits) and rounding once afterwards keeps every digit.
 *
 * Formula: centred_i = round_to_double(decimal(x_i) - offset), with offset the
 * integer part of the first value. Numbers (already doubles) are shifted by
 * plain subtraction, which is exact for values close to the offset (Sterbenz
 * lemma).
 *
 * Reference: NIST Statistical Reference Datasets, ANOVA "lower, average and
 * higher difficulty" sets (https://www.itl.nist.gov/div898/strd/).
 *
 * @example
 * centreDecimalValues(["1000000000000.4", "1000000000000.6"])
 * // { offset: 1000000000000, centred: Float64Array [0.4, 0.6] }
 */
export function centreDecimalValues(values: ReadonlyArray<string | number>): CentredValues {
  const centred = new Float64Array(values.length);
  if (values.length === 0) return { offset: 0, centred };
  const offsetInteger = integerPartOf(values[0]);
  const offset = Number(offsetInteger);
  for (let index = 0; index < values.length; index++) {
    const value = values[index];
    if (typeof value === "number") {
      centred[index] = value - offset;
      continue;
    }
    const text = value.trim();
    const match = plainDecimal.exec(text);
    if (!match || (match[2] === "" && (match[3] ?? "") === "")) {
      const parsed = Number(text);
      if (text === "" || !Number.isFinite(parsed)) {
        throw new StatsInputError(`analysis requires numeric responses, got "${value}"`);
      }
      centred[index] = parsed - offset;
      continue;
    }
    const negative = match[1] === "-";
    const integerPart = BigInt(match[2] === "" ? "0" : match[2]);
    const fractionDigits = match[3] ?? "";
    const signedInteger = (negative ? -integerPart : integerPart) - offsetInteger;
    if (fractionDigits === "") {
      centred[index] = Number(signedInteger);
      continue;
    }
    const fraction = BigInt(fractionDigits);
    const scaled = signedInteger * 10n ** BigInt(fractionDigits.length) + (negative ? -fraction : fraction);
    centred[index] = Number(`${scaled}e-${fractionDigits.length}`);
  }
  return { offset, centred };
}

function integerPartOf(value: string | number): bigint {
  if (typeof value === "number") return Number.isFinite(value) ? BigInt(Math.trunc(value)) : 0n;
  const match = plainDecimal.exec(value.trim());
  if (match && match[2] !== "") return BigInt(match[1] === "-" ? `-${match[2]}` : match[2]);
  const parsed = Number(value);
  return Number.isFinite(parsed) ? BigInt(Math.trunc(parsed)) : 0n;
}
