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
