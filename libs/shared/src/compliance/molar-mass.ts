/**
 * Standard atomic weights used for molar masses, g/mol. Na and K are CIAAW values (Na 22.98976928(2),
 * K 39.0983(1)); H, C and O are the conventional values 1.008, 12.011 and 15.999, which fall inside
 * the CIAAW 2021 intervals (from memory that CIAAW publishes exactly these as its conventional values).
 */
export const ATOMIC_WEIGHTS: Readonly<Record<string, number>> = {
  H: 1.008,
  C: 12.011,
  O: 15.999,
  Na: 22.98976928,
  K: 39.0983,
};

/**
 * Molar mass of a formula such as `NaHCO3`, `Na3C6H5O7` or `C6H8O7(H2O)` (a hydrate written in
 * brackets), g/mol. Supports element symbols, counts and nested brackets with a multiplier. Throws
 * on an element Batchproof has no atomic weight for or on a malformed formula.
 */
export function molarMass(formula: string): number {
  let position = 0;
  const parseGroup = (): number => {
    let mass = 0;
    while (position < formula.length) {
      const char = formula[position]!;
      if (char === '(') {
        position += 1;
        const inner = parseGroup();
        if (formula[position] !== ')') throw new Error(`Unclosed bracket in formula "${formula}"`);
        position += 1;
        mass += inner * readCount();
      } else if (char === ')') {
        return mass;
      } else {
        const match = /^[A-Z][a-z]?/.exec(formula.slice(position));
        if (!match) throw new Error(`Unexpected "${char}" in formula "${formula}"`);
        const weight = ATOMIC_WEIGHTS[match[0]];
        if (weight === undefined)
          throw new Error(`No atomic weight for ${match[0]} in formula "${formula}"`);
        position += match[0].length;
        mass += weight * readCount();
      }
    }
    return mass;
  };
  const readCount = (): number => {
    const match = /^\d+/.exec(formula.slice(position));
    if (!match) return 1;
    position += match[0].length;
    return Number(match[0]);
  };
  const mass = parseGroup();
  if (position !== formula.length) throw new Error(`Unbalanced bracket in formula "${formula}"`);
  return mass;
}
