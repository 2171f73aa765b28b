/**
 * Weeding cost of one treatment per hectare and season, from the trial plan.
 *
 * labour = hours per ha (all passes of the season) × labour rate per hour
 * equipment = purchase cost ÷ (useful life in years × hectares worked per year): straight-line
 *   spreading with no salvage value or interest, so the machine's price is shared by every
 *   hectare it works in its life
 * total = labour + materials + equipment
 *
 * Parts the plan leaves blank count as 0 and are named in `missing`, so a low total is never
 * mistaken for a complete one.
 */
export interface TreatmentCostInput {
  code: string;
  name: string;
  passes: number;
  labourHoursPerHa: number | null;
  materialCostPerHa: number | null;
  equipmentCost: number | null;
  equipmentLifeYears: number | null;
  equipmentHaPerYear: number | null;
}

export interface TreatmentCost {
  code: string;
  name: string;
  passes: number;
  labourHoursPerHa: number;
  labourCostPerHa: number;
  materialCostPerHa: number;
  equipmentCostPerHa: number;
  totalPerHa: number;
  missing: Array<"labour" | "materials" | "equipment">;
}

export function equipmentCostPerHectare(cost: number | null, lifeYears: number | null, hectaresPerYear: number | null): number | null {
  if (cost === null) return null;
  if (cost === 0) return 0;
  if (!lifeYears || !hectaresPerYear || lifeYears <= 0 || hectaresPerYear <= 0) return null;
  return cost / (lifeYears * hectaresPerYear);
}

export function treatmentCost(input: TreatmentCostInput, labourRatePerHour: number): TreatmentCost {
  const missing: TreatmentCost["missing"] = [];
  if (input.labourHoursPerHa === null) missing.push("labour");
  if (input.materialCostPerHa === null) missing.push("materials");
  const equipment = equipmentCostPerHectare(input.equipmentCost, input.equipmentLifeYears, input.equipmentHaPerYear);
  if (input.equipmentCost !== null && equipment === null) missing.push("equipment");
  const labourHoursPerHa = input.labourHoursPerHa ?? 0;
  const labourCostPerHa = labourHoursPerHa * labourRatePerHour;
  const materialCostPerHa = input.materialCostPerHa ?? 0;
  const equipmentCostPerHa = equipment ?? 0;
  return {
    code: input.code,
    name: input.name,
    passes: input.passes,
    labourHoursPerHa,
    labourCostPerHa,
    materialCostPerHa,
    equipmentCostPerHa,
    totalPerHa: labourCostPerHa + materialCostPerHa + equipmentCostPerHa,
    missing,
  };
}

/**
 * Money spent per percentage point of weed control: total ÷ percent control. Only meaningful
 * when the method reduced weeds; null otherwise.
 */
export function costPerPercentControl(totalPerHa: number, percentControl: number | null): number | null {
  if (percentControl === null || !(percentControl > 0)) return null;
  return totalPerHa / percentControl;
}
