/** Lower-case, trimmed, single-spaced form of a name, for matching. */
export function normaliseName(name: string): string {
  return name.trim().replace(/\s+/g, ' ').toLowerCase();
}

const CI_PATTERN = /^(?:c\.?\s*i\.?\s*)?(\d{5})(?:\s*:\s*(\d))?$/i;

/** Parses `CI 77891`, `77891` or `15850:1` into `77891` / `15850:1`; null when it is not a CI number. */
export function parseColourIndex(value: string): string | null {
  const match = CI_PATTERN.exec(value.trim());
  if (!match) return null;
  return match[2] === undefined ? match[1]! : `${match[1]}:${match[2]}`;
}

/** The CI number without its salt/lake suffix: `15850:1` → `15850`. */
export function baseColourIndex(ci: string): string {
  return ci.split(':')[0]!;
}

/** Sort key for EU declarations: colourants by CI number. */
export function compareColourIndex(a: string, b: string): number {
  const [aBase, aSalt = '0'] = a.split(':');
  const [bBase, bSalt = '0'] = b.split(':');
  return Number(aBase) - Number(bBase) || Number(aSalt) - Number(bSalt);
}

/** How a fragrance or flavour designation is written in an ingredient list, by market group. */
export type FragranceWord = 'fragrance' | 'flavour';

const FRAGRANCE_WORDS = new Set([
  'fragrance',
  'parfum',
  'perfume',
  'fragrance (parfum)',
  'parfum (fragrance)',
  'fragrance/parfum',
  'parfum/fragrance',
]);
const FLAVOUR_WORDS = new Set(['aroma', 'flavor', 'flavour', 'flavor (aroma)', 'aroma (flavor)']);

/** Whether an INCI name is a fragrance or flavour designation rather than a named substance. */
export function fragranceWordOf(inci: string): FragranceWord | null {
  const name = normaliseName(inci);
  if (FRAGRANCE_WORDS.has(name)) return 'fragrance';
  if (FLAVOUR_WORDS.has(name)) return 'flavour';
  return null;
}

/** Whether a function list marks the ingredient as a colourant. */
export function isColourantFunction(functions: readonly string[]): boolean {
  return functions.some((f) =>
    /colou?rant|colou?ring|colou?r additive|^\s*(pigment|dye)\s*$/i.test(f),
  );
}

/**
 * Whether a function list says the ingredient serves as a detergent or foaming agent (cleansing
 * surfactant, foam booster), the test 21 CFR 740.17 applies.
 */
export function isDetergentOrFoamingFunction(functions: readonly string[]): boolean {
  return functions.some((f) => /deterg|foam|cleans/i.test(f));
}

/** Whether a function list says "surfactant" without saying what it does (emulsifier? cleanser?). */
export function isUnqualifiedSurfactant(functions: readonly string[]): boolean {
  return functions.some((f) => normaliseName(f) === 'surfactant');
}
