import * as z from 'zod';

/** GS1 AI encodable character set 82, the characters allowed in AI (10) batch/lot. */
export const GS1_CSET_82 = `!"%&'()*+,-./0123456789:;<=>?ABCDEFGHIJKLMNOPQRSTUVWXYZ_abcdefghijklmnopqrstuvwxyz`;
const CSET_82 = new Set(GS1_CSET_82);

/**
 * GS1 check digit (GS1 General Specifications §7.9.1): weights 3, 1, 3, 1 … from the rightmost data
 * digit; the check digit brings the weighted sum up to a multiple of 10. Throws on non-digits.
 */
export function gs1CheckDigit(digits: string): number {
  if (!/^\d{1,17}$/.test(digits))
    throw new RangeError('GS1 data for a check digit must be 1 to 17 digits');
  let sum = 0;
  for (let i = 0; i < digits.length; i += 1) {
    const digit = Number(digits[digits.length - 1 - i]);
    sum += digit * (i % 2 === 0 ? 3 : 1);
  }
  return (10 - (sum % 10)) % 10;
}

function describeChar(char: string): string {
  return char === ' ' ? 'space' : `"${char}"`;
}

/** A GS1 date (AI 15 or 17) as `YYYY-MM-DD`, or `YYYY-MM` when only the month is known (day 00). */
const gs1DateSchema = (what: string) => {
  const What = what[0]!.toUpperCase() + what.slice(1);
  return z
    .string()
    .trim()
    .superRefine((expiry, ctx) => {
      const match = /^(\d{4})-(\d{2})(?:-(\d{2}))?$/.exec(expiry);
      if (!match) {
        ctx.addIssue({
          code: 'custom',
          message: `Enter the ${what} as YYYY-MM-DD, or YYYY-MM for a month`,
        });
        return;
      }
      const [year, month, day] = [
        Number(match[1]),
        Number(match[2]),
        match[3] === undefined ? undefined : Number(match[3]),
      ];
      if (year < 2000 || year > 2099)
        ctx.addIssue({
          code: 'custom',
          message: `${What} year must be between 2000 and 2099 (the AI stores two digits)`,
        });
      if (month < 1 || month > 12)
        ctx.addIssue({ code: 'custom', message: `${What} month must be 01 to 12` });
      if (day !== undefined) {
        const last = new Date(Date.UTC(year, month, 0)).getUTCDate();
        if (day < 1 || day > last)
          ctx.addIssue({
            code: 'custom',
            message: `${What} day must be 01 to ${last} for that month`,
          });
      }
    });
};

/** Input of {@link gs1ElementString}. */
export const gs1ElementInputSchema = z.object({
  /** A complete GTIN-8, -12, -13 or -14 including its check digit. */
  gtin: z
    .string()
    .trim()
    .superRefine((gtin, ctx) => {
      if (!/^(\d{8}|\d{12}|\d{13}|\d{14})$/.test(gtin)) {
        ctx.addIssue({
          code: 'custom',
          message: 'A GTIN has 8, 12, 13 or 14 digits, including the check digit',
        });
        return;
      }
      const expected = gs1CheckDigit(gtin.slice(0, -1));
      if (Number(gtin.slice(-1)) !== expected) {
        ctx.addIssue({
          code: 'custom',
          message: `The GTIN's check digit should be ${expected}, not ${gtin.slice(-1)}: check the number`,
        });
      }
    })
    .optional(),
  /** Expiry (AI 17) as `YYYY-MM-DD`, or `YYYY-MM` when only the month is known (encoded with day 00). */
  expiry: gs1DateSchema('expiry').optional(),
  /** Best before (AI 15), the same way: for a durability date rather than an expiry. */
  bestBefore: gs1DateSchema('best-before date').optional(),
  /** Batch/lot: 1 to 20 characters of GS1 character set 82. */
  lot: z.string({ error: 'Enter a lot code' }).superRefine((lot, ctx) => {
    if (lot.length === 0) {
      ctx.addIssue({ code: 'custom', message: 'Enter a lot code' });
      return;
    }
    if (lot.length > 20)
      ctx.addIssue({
        code: 'custom',
        message: `A GS1 lot code has at most 20 characters; this one has ${lot.length}`,
      });
    const bad = [...new Set([...lot].filter((c) => !CSET_82.has(c)))];
    if (bad.length > 0) {
      ctx.addIssue({
        code: 'custom',
        message: `GS1 lot codes cannot contain ${bad.map(describeChar).join(', ')}. Use letters, digits and ! " % & ' ( ) * + , - . / : ; < = > ? _`,
      });
    }
  }),
});
/** Input of {@link gs1ElementString}. */
export type Gs1ElementInput = z.input<typeof gs1ElementInputSchema>;

/** A GS1 element string for a lot barcode. */
export interface Gs1ElementString {
  /** Human-readable form, e.g. `(01)09521234543213(17)260731(10)LOT-42A`. */
  readonly hri: string;
  /** Data to encode after the leading FNC1; AI (10) goes last so no separator is needed. */
  readonly data: string;
  readonly elements: { ai: '01' | '15' | '17' | '10'; title: string; value: string }[];
  /** Things that are valid to encode but worth knowing. */
  readonly warnings: string[];
}

const DAY_00 = 'Day 00 means the last day of that month.';

/**
 * Builds the GS1 element string (01) GTIN-14 + (15) best before and/or (17) expiry YYMMDD + (10)
 * batch/lot, in that order so the variable-length lot comes last (GS1 General Specifications;
 * GS1 Barcode Syntax Dictionary: AI 15 BEST BEFORE or BEST BY, AI 17 USE BY or EXPIRY).
 * Throws a ZodError with field paths and plain messages on invalid input.
 */
export function gs1ElementString(input: Gs1ElementInput): Gs1ElementString {
  const { gtin, expiry, bestBefore, lot } = gs1ElementInputSchema.parse(input);
  const elements: Gs1ElementString['elements'] = [];
  const warnings: string[] = [];
  if (gtin !== undefined) elements.push({ ai: '01', title: 'GTIN', value: gtin.padStart(14, '0') });
  else
    warnings.push(
      'GS1 requires AI (10) batch/lot to be used together with a GTIN (01); without one this is an internal code, not a valid GS1 barcode.',
    );
  const dates = [
    { ai: '15' as const, title: 'BEST BEFORE or BEST BY', date: bestBefore },
    { ai: '17' as const, title: 'USE BY or EXPIRY', date: expiry },
  ];
  for (const { ai, title, date } of dates) {
    if (date === undefined) continue;
    const [year, month, day = '00'] = date.split('-') as [string, string, string?];
    elements.push({ ai, title, value: `${year.slice(2)}${month}${day}` });
    if (day === '00' && !warnings.includes(DAY_00)) warnings.push(DAY_00);
  }
  elements.push({ ai: '10', title: 'BATCH/LOT', value: lot });
  return {
    hri: elements.map((e) => `(${e.ai})${e.value}`).join(''),
    data: elements.map((e) => `${e.ai}${e.value}`).join(''),
    elements,
    warnings,
  };
}
