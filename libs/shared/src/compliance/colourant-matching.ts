import {
  euAnnexIvColourants,
  type EuAnnexIvColourant,
} from '../reference-data/eu-annex-iv-colourants';
import { isInEffect } from '../reference-data/reference-row';
import {
  usColourAdditives,
  usNotPermittedColourants,
  type UsColourAdditive,
  type UsNotPermittedColourant,
} from '../reference-data/us-colour-additives';
import { baseColourIndex, normaliseName } from './ingredient-names';

/** What a colourant matched in the US lists. */
export type UsColourMatch =
  | { kind: 'listed'; row: UsColourAdditive; lake: boolean }
  | { kind: 'not-permitted'; row: UsNotPermittedColourant }
  | { kind: 'ambiguous'; rows: UsColourAdditive[] }
  | { kind: 'none' };

const LAKE_SUFFIX = /\s+(?:(?:aluminum|aluminium|al|calcium|ca|barium|ba)\s+)?lake$/i;

function addTo<K, V>(map: Map<K, V[]>, key: K, value: V): void {
  const list = map.get(key);
  if (list) list.push(value);
  else map.set(key, [value]);
}

const usByCi = new Map<string, UsColourAdditive[]>();
const usByName = new Map<string, UsColourAdditive[]>();
for (const row of usColourAdditives) {
  for (const ci of row.colourIndex) addTo(usByCi, ci, row);
  for (const name of [row.name, ...row.aliases]) addTo(usByName, normaliseName(name), row);
}
const notPermittedByCi = new Map<string, UsNotPermittedColourant>();
const notPermittedByName = new Map<string, UsNotPermittedColourant>();
for (const row of usNotPermittedColourants) {
  for (const ci of row.colourIndex) notPermittedByCi.set(ci, row);
  for (const name of [row.name, ...row.aliases]) notPermittedByName.set(normaliseName(name), row);
}
const euByCi = new Map<string, EuAnnexIvColourant>();
const euByName = new Map<string, EuAnnexIvColourant>();
for (const row of euAnnexIvColourants) {
  if (row.colourIndex) euByCi.set(row.colourIndex, row);
  else euByName.set(normaliseName(row.name), row);
}

/** A name with any lake suffix removed, and whether there was one. */
function stripLake(name: string): { name: string; lake: boolean } {
  const normalised = normaliseName(name);
  const stripped = normalised.replace(LAKE_SUFFIX, '');
  return { name: stripped, lake: stripped !== normalised };
}

/** Whether two rows give the same answer for every exposure, so an ambiguous CI needs no US name. */
function sameUses(a: UsColourAdditive, b: UsColourAdditive): boolean {
  return (
    JSON.stringify(a.uses) === JSON.stringify(b.uses) &&
    a.certificationRequired === b.certificationRequired &&
    a.status === b.status
  );
}

/**
 * Matches a colourant to the US lists by its US name together with its CI number: CI numbers are not
 * unique US keys (CI 42090 is FD&C Blue No. 1 and D&C Blue No. 4), so a CI shared by listings with
 * different uses needs the US name (regulatory sources file, section 15).
 */
export function matchUsColourant(
  colourant: { colourIndex: string | undefined; usName: string | undefined; inci: string },
  asOf: string,
): UsColourMatch {
  const names = [colourant.usName, colourant.inci]
    .filter((n): n is string => n !== undefined)
    .map(stripLake);
  const lake = names.some((n) => n.lake);
  const ci = colourant.colourIndex;
  if (ci !== undefined) {
    const banned = notPermittedByCi.get(ci);
    if (banned) return { kind: 'not-permitted', row: banned };
  }
  for (const n of names) {
    const banned = notPermittedByName.get(n.name);
    if (banned && (ci === undefined || banned.colourIndex.includes(ci)))
      return { kind: 'not-permitted', row: banned };
  }
  let candidates: UsColourAdditive[] = [];
  if (ci !== undefined) {
    candidates = usByCi.get(ci) ?? usByCi.get(baseColourIndex(ci)) ?? [];
  }
  const byName = names.flatMap((n) => usByName.get(n.name) ?? []);
  if (candidates.length === 0) candidates = byName;
  else if (byName.length > 0) {
    const both = candidates.filter((row) => byName.includes(row));
    if (both.length > 0) candidates = both;
  }
  candidates = [...new Set(candidates)].filter((row) => isInEffect(row, asOf));
  if (candidates.length === 0) return { kind: 'none' };
  const first = candidates[0]!;
  if (candidates.every((row) => sameUses(row, first))) return { kind: 'listed', row: first, lake };
  return { kind: 'ambiguous', rows: candidates };
}

/** Matches a colourant to an Annex IV entry: by CI number (an entry covers its salts and lakes), else by name. */
export function matchEuColourant(
  colourant: { colourIndex: string | undefined; inci: string },
  asOf: string,
): EuAnnexIvColourant | null {
  const row =
    colourant.colourIndex !== undefined
      ? euByCi.get(baseColourIndex(colourant.colourIndex))
      : euByName.get(normaliseName(colourant.inci));
  return row && isInEffect(row, asOf) ? row : null;
}
