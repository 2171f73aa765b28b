/**
 * The invented demo scenario: a made-up research farm and field station in a made-up valley.
 * Every name here is fictional. Demo data are for showing the product, never for checks.
 */
export const DEMO_PASSWORD = "hoebench-demo";

export const demoUsers = [
  { key: "admin", email: "admin@hoebench.test", name: "Agnes Ploughwright", role: "admin" },
  { key: "researcher", email: "researcher@hoebench.test", name: "Petra Quillfeather", role: "researcher" },
  { key: "researcher2", email: "researcher2@hoebench.test", name: "Osric Fenwold", role: "researcher" },
  { key: "technician", email: "technician@hoebench.test", name: "Tomas Brindlewood", role: "technician" },
  { key: "reviewer", email: "reviewer@hoebench.test", name: "Ilse Marrowby", role: "reviewer" },
  { key: "grower", email: "grower@hoebench.test", name: "Dale Furrowgate", role: "grower" },
] as const;

export const demoSites = [
  {
    key: "tamsel",
    name: "Tamsel Creek Research Farm",
    location: "North terrace, field 4",
    region: "Vell Valley",
    soil: "Silt loam, 2.1% organic matter",
    notes: "Overhead irrigation; heavy purslane and pigweed pressure in summer.",
  },
  {
    key: "orrin",
    name: "Orrin Flats Field Station",
    location: "East block, bed set C",
    region: "Corvin Plains",
    soil: "Sandy loam, 1.2% organic matter",
    notes: "Drip irrigation; lambsquarters and crabgrass dominate.",
  },
] as const;

/** Each trial's status once seeded; a "published" one is published by the seed through the app's own path (./seed.ts). */
export const demoTrials = [
  {
    key: "lettuce-tamsel",
    title: "Lettuce weed control: mulches, flame, cultivation and a solar weeding robot",
    crop: "Lettuce",
    season: "2026",
    site: "tamsel",
    owner: "researcher",
    status: "active",
    objective: "Compare non-chemical weed control in transplanted lettuce against weedy and weed-free checks, and test whether a small solar weeding robot controls weeds as well as hand hoeing.",
    blocks: 4,
    plantingDate: "2026-05-12",
    randomSeed: 20260512,
  },
  {
    key: "lettuce-orrin",
    title: "Lettuce weed control: mulches, flame, cultivation and a solar weeding robot (second site)",
    crop: "Lettuce",
    season: "2026",
    site: "orrin",
    owner: "researcher",
    status: "active",
    objective: "The same protocol at a second site with lighter soil and other weeds.",
    blocks: 4,
    plantingDate: "2026-05-19",
    randomSeed: 20260519,
  },
  {
    key: "onion-2025",
    title: "Onion weed control: hand hoeing, straw mulch and finger cultivation",
    crop: "Onion",
    season: "2025",
    site: "tamsel",
    owner: "researcher",
    status: "published",
    objective: "Weed control and labour of three methods in direct-seeded onion.",
    blocks: 4,
    plantingDate: "2025-04-22",
    randomSeed: 20250422,
  },
  {
    key: "carrot-draft",
    title: "Carrot pre-emergence flaming timing",
    crop: "Carrot",
    season: "2027",
    site: "orrin",
    owner: "researcher2",
    status: "draft",
    objective: "When to flame before carrot emergence.",
    blocks: 4,
    plantingDate: null,
    randomSeed: 20270401,
  },
] as const;

export const demoMemberships = [
  { trial: "lettuce-tamsel", user: "technician", role: "technician" },
  { trial: "lettuce-orrin", user: "technician", role: "technician" },
  { trial: "lettuce-tamsel", user: "reviewer", role: "reviewer" },
  { trial: "lettuce-orrin", user: "reviewer", role: "reviewer" },
  { trial: "onion-2025", user: "reviewer", role: "reviewer" },
] as const;

/*
 * Trial protocols: treatments in list order (the order randomization draws from) and planned
 * assessments. Labour hours and material costs per hectare are invented but of a plausible size.
 */
type DemoTreatment = {
  code: string;
  name: string;
  category: "check" | "hand" | "mulch" | "cultivation" | "thermal" | "robotic" | "chemical" | "other";
  checkType: "weedy" | "weed-free" | null;
  description: string;
  timing: string;
  rateOrSettings: string;
  passes: number;
  labourHoursPerHa: number | null;
  materialCostPerHa: number | null;
};

type DemoAssessment = {
  name: string;
  variable: "weed-density" | "weed-biomass" | "crop-yield" | "crop-injury" | "weed-control-rating" | "labour-time" | "custom";
  unit: string;
  timingDays: number | null;
  timingReference: "planting" | "treatment" | null;
  quadratsPerPlot: number;
  plausibleMin: number | null;
  plausibleMax: number | null;
  notes: string;
};

const weedyCheck: DemoTreatment = {
  code: "WC", name: "Weedy check", category: "check", checkType: "weedy",
  description: "No weed control all season; the baseline for percent control.",
  timing: "None", rateOrSettings: "", passes: 0, labourHoursPerHa: 0, materialCostPerHa: 0,
};
const weedFreeCheck: DemoTreatment = {
  code: "WF", name: "Weed-free check", category: "check", checkType: "weed-free",
  description: "Kept free of weeds by hand every week; the crop's yield potential.",
  timing: "Weekly from planting to harvest", rateOrSettings: "", passes: 7, labourHoursPerHa: 210, materialCostPerHa: 0,
};
const handHoeing: DemoTreatment = {
  code: "HH", name: "Hand hoeing", category: "hand", checkType: null,
  description: "Stirrup hoe between rows and around plants.",
  timing: "14 and 28 days after planting", rateOrSettings: "Stirrup hoe, 12 cm blade", passes: 2, labourHoursPerHa: 85, materialCostPerHa: 0,
};
const strawMulch: DemoTreatment = {
  code: "SM", name: "Straw mulch", category: "mulch", checkType: null,
  description: "Chopped cereal straw spread between rows after planting.",
  timing: "Within 3 days of planting", rateOrSettings: "8 t/ha, about 5 cm deep", passes: 1, labourHoursPerHa: 42, materialCostPerHa: 720,
};

export const lettuceTreatments: DemoTreatment[] = [
  weedyCheck,
  weedFreeCheck,
  handHoeing,
  strawMulch,
  {
    code: "BF", name: "Biodegradable film mulch", category: "mulch", checkType: null,
    description: "Starch-based black film laid on the beds, crop planted through punched holes.",
    timing: "Laid before planting", rateOrSettings: "15 µm film, 1.2 m wide", passes: 1, labourHoursPerHa: 18, materialCostPerHa: 950,
  },
  {
    code: "FL", name: "Flame weeding", category: "thermal", checkType: null,
    description: "Walk-behind propane flamer along the inter-row, shielded from the crop.",
    timing: "10 and 24 days after planting", rateOrSettings: "Four burners, 3 km/h, 0.3 MPa", passes: 2, labourHoursPerHa: 7, materialCostPerHa: 180,
  },
  {
    code: "FT", name: "Finger and tine cultivation", category: "cultivation", checkType: null,
    description: "Tractor-mounted finger weeders in the row with spring tines between rows.",
    timing: "10, 20 and 30 days after planting", rateOrSettings: "4 km/h, fingers set 1 cm from plants", passes: 3, labourHoursPerHa: 4.5, materialCostPerHa: 25,
  },
  {
    code: "SR", name: "Small solar weeding robot", category: "robotic", checkType: null,
    description: "A battery and solar-panel robot that patrols the beds and cuts weed seedlings with a small rotating blade.",
    timing: "Daily from 7 days after planting until canopy closure", rateOrSettings: "Blade 2 cm from plants, 0.5 km/h", passes: 30, labourHoursPerHa: 3, materialCostPerHa: 60,
  },
];

export const onionTreatments: DemoTreatment[] = [
  weedyCheck,
  weedFreeCheck,
  { ...handHoeing, timing: "21, 42 and 63 days after planting", passes: 3, labourHoursPerHa: 140 },
  { ...strawMulch, timing: "At the 2-leaf stage", labourHoursPerHa: 45 },
  {
    code: "FC", name: "Finger cultivation", category: "cultivation", checkType: null,
    description: "Tractor-mounted finger weeders working in the onion rows.",
    timing: "21, 35, 49 and 63 days after planting", rateOrSettings: "3.5 km/h", passes: 4, labourHoursPerHa: 6, materialCostPerHa: 30,
  },
];

const weedDensity = (days: number): DemoAssessment => ({
  name: `Weed density, ${days} days after planting`, variable: "weed-density", unit: "plants per quadrat",
  timingDays: days, timingReference: "planting", quadratsPerPlot: 4, plausibleMin: 0, plausibleMax: 500,
  notes: "Count all weeds in four 0.25 m² quadrats per plot, placed at random in the centre rows.",
});

function protocolAssessments(densityDays: number[], biomassDay: number, harvestDay: number): DemoAssessment[] {
  return [
    ...densityDays.map(weedDensity),
    {
      name: "Weed dry biomass", variable: "weed-biomass", unit: "g per quadrat", timingDays: biomassDay, timingReference: "planting",
      quadratsPerPlot: 2, plausibleMin: 0, plausibleMax: 400, notes: "Clip weeds at soil level in two quadrats, dry at 65 °C for 72 h, weigh.",
    },
    {
      name: "Crop yield", variable: "crop-yield", unit: "kg per plot", timingDays: harvestDay, timingReference: "planting",
      quadratsPerPlot: 1, plausibleMin: 0, plausibleMax: 60, notes: "Harvest the marketable crop from the harvest area and weigh.",
    },
    {
      name: "Labour time", variable: "labour-time", unit: "h per plot", timingDays: null, timingReference: null,
      quadratsPerPlot: 1, plausibleMin: 0, plausibleMax: 10, notes: "Add up the time of every weeding operation in the plot over the season.",
    },
  ];
}

export const demoProtocols: Record<string, { serpentine: boolean; treatments: DemoTreatment[]; assessments: DemoAssessment[] }> = {
  "lettuce-tamsel": { serpentine: true, treatments: lettuceTreatments, assessments: protocolAssessments([14, 28, 42], 42, 56) },
  "lettuce-orrin": { serpentine: true, treatments: lettuceTreatments, assessments: protocolAssessments([14, 28, 42], 42, 56) },
  "onion-2025": { serpentine: false, treatments: onionTreatments, assessments: protocolAssessments([21, 42, 63], 63, 120) },
};
