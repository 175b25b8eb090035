/**
 * Exact US customary and avoirdupois conversion constants (NIST Handbook 44/133 tables; the US
 * gallon is 231 cubic inches and the inch is exactly 2.54 cm).
 */
export const US_UNITS = {
  /** 1 avoirdupois pound, grams (exact). */
  poundGrams: 453.59237,
  /** 1 avoirdupois ounce = 1/16 lb, grams (exact). */
  ounceGrams: 28.349523125,
  /** 1 cubic inch, millilitres (exact, 2.54³). */
  cubicInchMillilitres: 16.387064,
  /** 1 US gallon = 231 in³, millilitres. */
  gallonMillilitres: 3785.411784,
  /** 1 US fluid ounce = 1/128 gallon, millilitres. */
  fluidOunceMillilitres: 29.5735295625,
  /** 1 US pint = 16 fl oz, millilitres. */
  pintMillilitres: 473.176473,
  /** 1 US cup = 8 fl oz, millilitres. */
  cupMillilitres: 236.5882365,
  /** 1 US tablespoon = 1/2 fl oz, millilitres. */
  tablespoonMillilitres: 14.78676478125,
  /** 1 US teaspoon = 1/6 fl oz, millilitres. */
  teaspoonMillilitres: 4.92892159375,
} as const;
