/**
 * Invented demo assumptions, stated wherever they are used; readers change them on the page.
 * They are not market data: prices and wages differ by place, year and grade.
 */
export const DEFAULT_LABOUR_RATE_PER_HOUR = 18;

/** Invented farm-gate prices per kg, by crop (lower case); others fall back to the default. */
const cropPricesPerKg: Record<string, number> = {
  onion: 0.4,
  lettuce: 0.9,
  carrot: 0.5,
};
export const FALLBACK_CROP_PRICE_PER_KG = 0.5;

export function defaultCropPricePerKg(crop: string): number {
  return cropPricesPerKg[crop.trim().toLowerCase()] ?? FALLBACK_CROP_PRICE_PER_KG;
}

export const CURRENCY = "$";
