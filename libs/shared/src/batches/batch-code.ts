import { GS1_CSET_82 } from '../compliance/gs1-element-string';
import { addDays, daysBetween, isCalendarDay } from '../dates/calendar-day';
import { bestBeforeMonth } from '../labels/label-durability';
import type { ProductIdentity } from '../labels/product-identity';
import { textField } from '../records/record-fields';

/**
 * Batch codes from a workshop pattern, printed as the lot on labels and in the GS1 (10) barcode,
 * so they may only hold characters of GS1 character set 82 and at most 20 of them (GS1 General
 * Specifications, AI (10) BATCH/LOT: X..20).
 */

/** Most characters of a GS1 AI (10) batch/lot. */
export const BATCH_CODE_MAX = 20;
/** The workshop's pattern unless it sets its own: day, product code, sequence. */
export const DEFAULT_BATCH_CODE_PATTERN = '{YYMMDD}-{CODE}-{SEQ}';
/** Digits of `{SEQ}`; `{SEQ:n}` sets 1 to 6. */
export const DEFAULT_SEQUENCE_DIGITS = 3;

/** The tokens a pattern may use, what each stands for, and how long it prints. */
export const BATCH_CODE_TOKENS = {
  YYYYMMDD: { meaning: 'year, month and day (20261202)', length: 8 },
  YYMMDD: { meaning: 'two-digit year, month and day (261202)', length: 6 },
  YYYY: { meaning: 'year (2026)', length: 4 },
  YY: { meaning: 'two-digit year (26)', length: 2 },
  MM: { meaning: 'month (12)', length: 2 },
  DD: { meaning: 'day of the month (02)', length: 2 },
  JJJ: { meaning: 'day of the year (336)', length: 3 },
  CODE: { meaning: 'the product code', length: 0 },
  SEQ: { meaning: `the batch's sequence number, zero-padded ({SEQ:4} for 4 digits)`, length: 0 },
} as const;
type TokenName = keyof typeof BATCH_CODE_TOKENS;

/** A parsed pattern piece. */
export type BatchCodePart =
  | { readonly kind: 'literal'; readonly text: string }
  | { readonly kind: 'token'; readonly token: Exclude<TokenName, 'SEQ'> }
  | { readonly kind: 'sequence'; readonly digits: number };

/** A parsed pattern: its parts, or the problems that stop it being used. */
export interface ParsedBatchCodePattern {
  readonly parts: BatchCodePart[];
  /** Characters every code has apart from the product code (literals, dates, sequence digits). */
  readonly fixedLength: number;
  readonly usesCode: boolean;
  readonly usesSequence: boolean;
  readonly problems: string[];
}

const CSET_82 = new Set(GS1_CSET_82);
const TOKEN = /\{([^{}]*)\}/g;
const TOKEN_LIST = Object.keys(BATCH_CODE_TOKENS)
  .map((t) => `{${t}}`)
  .join(', ');

function describe(char: string): string {
  if (char === ' ') return 'a space';
  const code = char.codePointAt(0)!;
  return code < 0x20 || code === 0x7f
    ? `the control character U+${code.toString(16).padStart(4, '0').toUpperCase()}`
    : `"${char}"`;
}

function literalProblems(text: string): string[] {
  const bad = [...new Set([...text].filter((c) => !CSET_82.has(c)))];
  return bad.map(
    (c) =>
      `A batch code cannot contain ${describe(c)}: GS1 lot codes use letters, digits and ! " % & ' ( ) * + , - . / : ; < = > ? _`,
  );
}

/** Reads a pattern into its parts, listing every problem in plain words. */
export function parseBatchCodePattern(pattern: string): ParsedBatchCodePattern {
  const parts: BatchCodePart[] = [];
  const problems: string[] = [];
  let fixedLength = 0;
  const literal = (text: string) => {
    if (text.length === 0) return;
    problems.push(...literalProblems(text));
    parts.push({ kind: 'literal', text });
    fixedLength += text.length;
  };
  let at = 0;
  for (const match of pattern.matchAll(TOKEN)) {
    literal(pattern.slice(at, match.index));
    at = match.index + match[0].length;
    const name = match[1]!;
    const sequence = /^SEQ(?::(\d+))?$/.exec(name);
    if (sequence) {
      const digits = sequence[1] === undefined ? DEFAULT_SEQUENCE_DIGITS : Number(sequence[1]);
      if (digits < 1 || digits > 6)
        problems.push(`{SEQ:${sequence[1]}}: a sequence has 1 to 6 digits`);
      parts.push({ kind: 'sequence', digits });
      fixedLength += digits;
    } else if (name in BATCH_CODE_TOKENS) {
      const token = name as Exclude<TokenName, 'SEQ'>;
      parts.push({ kind: 'token', token });
      fixedLength += BATCH_CODE_TOKENS[token].length;
    } else {
      problems.push(`{${name}} is not a token: use ${TOKEN_LIST} or {SEQ:n}`);
    }
  }
  literal(pattern.slice(at));
  const usesCode = parts.some((p) => p.kind === 'token' && p.token === 'CODE');
  const usesSequence = parts.some((p) => p.kind === 'sequence');
  if (pattern.trim().length === 0) problems.push('Enter a batch code pattern');
  else if (!usesSequence)
    problems.push(
      'Add {SEQ} to the pattern, so two batches made on the same day get different codes',
    );
  // With the shortest product code (1 character), the code must still fit.
  const shortest = fixedLength + (usesCode ? 1 : 0);
  if (shortest > BATCH_CODE_MAX)
    problems.push(
      `Codes from this pattern have at least ${shortest} characters; a GS1 lot code has at most ${BATCH_CODE_MAX}`,
    );
  return { parts, fixedLength, usesCode, usesSequence, problems };
}

/** The workshop's batch code pattern setting. */
export const batchCodePatternSchema = textField('Batch code pattern')
  .max(100, { error: 'The batch code pattern is too long (100 characters at most)' })
  .default(DEFAULT_BATCH_CODE_PATTERN)
  .superRefine((pattern, ctx) => {
    for (const message of parseBatchCodePattern(pattern).problems)
      ctx.addIssue({ code: 'custom', message });
  });

/** What a code is made from. */
export interface BatchCodeInput {
  /** The day the batch is made, YYYY-MM-DD. */
  readonly day: string;
  /** The product identity's code (letters, digits and '-'). */
  readonly productCode: string;
  /** The batch's sequence number, from 1. */
  readonly sequence: number;
}

/**
 * Why this pattern cannot make a code for this product and sequence (too long, a sequence that
 * does not fit its digits, a product code with other characters), or null when it can.
 */
export function batchCodeProblem(pattern: string, input: BatchCodeInput): string | null {
  const parsed = parseBatchCodePattern(pattern);
  if (parsed.problems.length > 0) return parsed.problems[0]!;
  if (!isCalendarDay(input.day)) return `Not a calendar day: ${input.day}`;
  if (!Number.isInteger(input.sequence) || input.sequence < 1)
    return 'The sequence must be a whole number from 1';
  for (const part of parsed.parts)
    if (part.kind === 'sequence' && input.sequence >= 10 ** part.digits)
      return `Sequence ${input.sequence} does not fit ${part.digits} digits: widen the pattern's sequence to {SEQ:${part.digits + 1}}`;
  if (parsed.usesCode) {
    if (input.productCode.length === 0) return 'The product has no product code';
    const bad = literalProblems(input.productCode);
    if (bad.length > 0) return `The product code: ${bad[0]!}`;
    const length = parsed.fixedLength + input.productCode.length;
    if (length > BATCH_CODE_MAX)
      return `The batch code would have ${length} characters; a GS1 lot code has at most ${BATCH_CODE_MAX}: shorten the product code to ${BATCH_CODE_MAX - parsed.fixedLength} characters or change the pattern`;
  }
  return null;
}

function tokenText(token: Exclude<TokenName, 'SEQ'>, day: string, productCode: string): string {
  const [yyyy, mm, dd] = day.split('-') as [string, string, string];
  switch (token) {
    case 'YYYYMMDD':
      return `${yyyy}${mm}${dd}`;
    case 'YYMMDD':
      return `${yyyy.slice(2)}${mm}${dd}`;
    case 'YYYY':
      return yyyy;
    case 'YY':
      return yyyy.slice(2);
    case 'MM':
      return mm;
    case 'DD':
      return dd;
    case 'JJJ':
      return String(daysBetween(`${yyyy}-01-01`, day) + 1).padStart(3, '0');
    case 'CODE':
      return productCode;
  }
}

/**
 * The batch code for a day, product and sequence: `{YYMMDD}-{CODE}-{SEQ}` on 2026-12-02 for RFF,
 * sequence 7, is `261202-RFF-007`. Throws a RangeError with {@link batchCodeProblem}'s message
 * when the pattern cannot make a valid code for it.
 */
export function formatBatchCode(pattern: string, input: BatchCodeInput): string {
  const problem = batchCodeProblem(pattern, input);
  if (problem) throw new RangeError(problem);
  return parseBatchCodePattern(pattern)
    .parts.map((part) => {
      if (part.kind === 'literal') return part.text;
      if (part.kind === 'sequence') return String(input.sequence).padStart(part.digits, '0');
      return tokenText(part.token, input.day, input.productCode);
    })
    .join('');
}

/** How long a batch keeps, from its product identity. */
export interface BatchDurability {
  /** The best-before month (`YYYY-MM`, printed "Best used before the end of 06/2028"), or null. */
  readonly bestBeforeMonth: string | null;
  /**
   * The last day of that month: the day the batch counts as expired for stock and home-page
   * reminders, and the date to send as `expiresOn` when a label prints an expiry date instead.
   */
  readonly expiresOn: string | null;
  /** The period after opening in months, when the product has one. */
  readonly periodAfterOpeningMonths: number | null;
}

/**
 * The batch's durability from the product identity's shelf life (minimum durability from
 * manufacture): the month through the labels' own `bestBeforeMonth`, so a batch and its labels
 * always agree. Made 2026-12-02 with 18 months → best before 2028-06, expired after 2028-06-30.
 * Without a shelf life only the period after opening is known.
 */
export function batchDurability(
  madeOn: string,
  identity: Pick<ProductIdentity, 'shelfLifeMonths' | 'periodAfterOpeningMonths'>,
): BatchDurability {
  if (!isCalendarDay(madeOn)) throw new RangeError(`Not a calendar day: ${madeOn}`);
  const { shelfLifeMonths, periodAfterOpeningMonths } = identity;
  if (shelfLifeMonths === null)
    return { bestBeforeMonth: null, expiresOn: null, periodAfterOpeningMonths };
  const month = bestBeforeMonth(madeOn, shelfLifeMonths);
  const [year, mm] = month.split('-').map(Number) as [number, number];
  const nextMonth =
    mm === 12 ? `${year + 1}-01-01` : `${year}-${String(mm + 1).padStart(2, '0')}-01`;
  return { bestBeforeMonth: month, expiresOn: addDays(nextMonth, -1), periodAfterOpeningMonths };
}
