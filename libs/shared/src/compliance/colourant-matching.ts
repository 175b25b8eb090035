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
  | { kind: 'listed'; row: UsColourAdditive; lake: boolean; lakeName: string | null }
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
const euKey = (key: string, nano: boolean) => `${key}|${nano ? 'nano' : 'plain'}`;
for (const row of euAnnexIvColourants) {
  if (row.colourIndex) euByCi.set(euKey(row.colourIndex, row.nano === true), row);
  else euByName.set(euKey(normaliseName(row.name), row.nano === true), row);
}

/** A name with any lake suffix removed, whether there was one, and the suffix as written. */
function stripLake(name: string): { name: string; lake: boolean; suffix: string | null } {
  const normalised = normaliseName(name);
  const stripped = normalised.replace(LAKE_SUFFIX, '');
  const suffix = LAKE_SUFFIX.exec(name.trim().replace(/\s+/g, ' '))?.[0].trim() ?? null;
  return { name: stripped, lake: stripped !== normalised, suffix };
}

/**
 * The lake designation as the US label prints it after the listed name: "Aluminum Lake", "Calcium
 * Lake" or "Lake" (21 CFR 82.51: lakes are named by the straight colour and the salt), in title case.
 */
function lakeDesignation(suffix: string): string {
  const words = suffix.toLowerCase().split(' ');
  const salt: Record<string, string> = {
    al: 'Aluminum',
    aluminum: 'Aluminum',
    aluminium: 'Aluminum',
    ca: 'Calcium',
    calcium: 'Calcium',
    ba: 'Barium',
    barium: 'Barium',
  };
  return words.length > 1 && salt[words[0]!] ? `${salt[words[0]!]} Lake` : 'Lake';
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
 * different uses needs the US name (FDA/ICMAD regulatory information sheet of permanently listed colours).
 */
export function matchUsColourant(
  colourant: { colourIndex: string | undefined; usName: string | undefined; inci: string },
  asOf: string,
): UsColourMatch {
  const names = [colourant.usName, colourant.inci]
    .filter((n): n is string => n !== undefined)
    .map(stripLake);
  const lake = names.some((n) => n.lake);
  const suffix = names.find((n) => n.suffix)?.suffix ?? null;
  const lakeName = lake && suffix ? lakeDesignation(suffix) : null;
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
  if (candidates.every((row) => sameUses(row, first)))
    return { kind: 'listed', row: first, lake, lakeName };
  return { kind: 'ambiguous', rows: candidates };
}

/**
 * Matches a colourant to an Annex IV entry: by CI number (an entry covers its salts and lakes), else by
 * name. A nanomaterial matches only the entry for the nano form, and an ordinary colourant only the
 * ordinary entry, so conditions written for one never fall on the other.
 */
export function matchEuColourant(
  colourant: { colourIndex: string | undefined; inci: string; nano?: boolean },
  asOf: string,
): EuAnnexIvColourant | null {
  const nano = colourant.nano === true;
  const row =
    colourant.colourIndex !== undefined
      ? euByCi.get(euKey(baseColourIndex(colourant.colourIndex), nano))
      : euByName.get(euKey(normaliseName(colourant.inci), nano));
  return row && isInEffect(row, asOf) ? row : null;
}
