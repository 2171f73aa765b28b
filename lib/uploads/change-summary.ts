import "server-only";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";
import { currentRawValues } from "@/lib/data/observations";
import { columnsOf, speciesAt, type ValueColumns } from "@/lib/observations/value-columns";

/** What a checked file would change against the values in place, cell by cell. */
export interface ChangeSummary {
  added: number;
  changed: number;
  unchanged: number;
  removed: number;
}

/** Assessments whose values in place are kept in memory. */
const ASSESSMENTS_KEPT = 4;

/**
 * The values in place, keyed by plot, quadrat and species (case aside), for the preview's
 * change summary. A version never changes once written, so the values current at an
 * assessment's latest version can be kept: after an upload commits, they are exactly the
 * file's values, and the next check of that assessment needs no 100,000-row read.
 */
export interface CurrentValues {
  versionId: string;
  source: ValueColumns;
  index?: ValueIndex;
}

/** Values by species (case aside), then by plot × 64 + quadrat: small-integer keys, no string per value. */
type ValueIndex = Map<string, Map<number, number>>;

const currentByAssessment = new Map<string, CurrentValues>();

export function rememberCurrentValues(assessmentId: string, values: CurrentValues): void {
  currentByAssessment.delete(assessmentId);
  currentByAssessment.set(assessmentId, values);
  while (currentByAssessment.size > ASSESSMENTS_KEPT) currentByAssessment.delete(currentByAssessment.keys().next().value!);
}

function indexValues(values: ValueColumns): ValueIndex {
  const index: ValueIndex = new Map();
  const bySpelling = values.speciesNames.map((name) => {
    const species = name.toLowerCase();
    let bySlot = index.get(species);
    if (!bySlot) index.set(species, (bySlot = new Map()));
    return bySlot;
  });
  for (let at = 0; at < values.plotNumbers.length; at += 1) {
    bySpelling[values.speciesIndexes[at]].set(values.plotNumbers[at] * 64 + values.quadrats[at], values.values[at]);
  }
  return index;
}

export async function currentValuesOf(assessmentId: string): Promise<CurrentValues | null> {
  const [latest] = await db().query<{ id: string }>(
    "SELECT id FROM dataset_versions WHERE assessment_id = :assessmentId ORDER BY number DESC LIMIT 1",
    { replacements: { assessmentId }, type: QueryTypes.SELECT },
  );
  if (!latest) return null;
  let current = currentByAssessment.get(assessmentId);
  if (current?.versionId !== latest.id) {
    current = { versionId: latest.id, source: columnsOf(await currentRawValues(assessmentId)) };
    rememberCurrentValues(assessmentId, current);
  }
  return current;
}

/** A corrected file usually lists the same cells in the same order as the one before: then no lookups are needed. */
function compareInStep(file: ValueColumns, before: ValueColumns): ChangeSummary | null {
  const count = file.plotNumbers.length;
  if (count !== before.plotNumbers.length) return null;
  const summary: ChangeSummary = { added: 0, changed: 0, unchanged: 0, removed: 0 };
  for (let at = 0; at < count; at += 1) {
    if (file.plotNumbers[at] !== before.plotNumbers[at] || file.quadrats[at] !== before.quadrats[at]) return null;
    const species = speciesAt(file, at);
    const speciesBefore = speciesAt(before, at);
    if (species !== speciesBefore && species.toLowerCase() !== speciesBefore.toLowerCase()) return null;
    if (before.values[at] === file.values[at]) summary.unchanged += 1;
    else summary.changed += 1;
  }
  return summary;
}

export function summarizeChanges(file: ValueColumns, current: CurrentValues | null): ChangeSummary {
  const count = file.plotNumbers.length;
  if (!current) return { added: count, changed: 0, unchanged: 0, removed: 0 };
  const inStep = compareInStep(file, current.source);
  if (inStep) return inStep;
  current.index ??= indexValues(current.source);
  const existing = current.index;
  const summary: ChangeSummary = { added: 0, changed: 0, unchanged: 0, removed: 0 };
  const bySpelling = file.speciesNames.map((name) => existing.get(name.toLowerCase()));
  for (let at = 0; at < count; at += 1) {
    const before = bySpelling[file.speciesIndexes[at]]?.get(file.plotNumbers[at] * 64 + file.quadrats[at]);
    if (before === undefined) summary.added += 1;
    else if (before === file.values[at]) summary.unchanged += 1;
    else summary.changed += 1;
  }
  // Keys are unique on both sides, so whatever was not met again is removed.
  let existingCount = 0;
  for (const values of existing.values()) existingCount += values.size;
  summary.removed = existingCount - summary.changed - summary.unchanged;
  return summary;
}
