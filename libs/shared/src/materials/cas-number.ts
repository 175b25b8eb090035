/**
 * CAS Registry Numbers: up to ten digits in three parts, the last a check digit. The check digit is
 * the sum of each other digit times its position counted from the right (1, 2, 3 …), modulo 10
 * (CAS, "CAS Registry Number" check digit rule).
 */
const CAS_SHAPE = /^(\d{2,7})-(\d{2})-(\d)$/;
const CAS_IN_TEXT = /\b\d{2,7}-\d{2}-\d\b/g;
const CAS_ANYWHERE = /\b\d{2,7}-\d{2}-\d\b/;

/** The check digit a CAS number's other digits call for, or null when it is not CAS-shaped. */
export function casCheckDigit(cas: string): number | null {
  const match = CAS_SHAPE.exec(cas.trim());
  if (!match) return null;
  const digits = `${match[1]}${match[2]}`;
  let sum = 0;
  for (let i = 0; i < digits.length; i += 1) {
    sum += Number(digits[digits.length - 1 - i]) * (i + 1);
  }
  return sum % 10;
}

/** Whether a CAS number is well formed and its check digit is right. */
export function isValidCas(cas: string): boolean {
  const expected = casCheckDigit(cas);
  return expected !== null && Number(cas.trim().slice(-1)) === expected;
}

/**
 * Problems with the CAS numbers written in a free-text CAS field ("8000-28-0; 90063-37-9"), one
 * message each, or an empty list.
 */
export function casProblems(text: string): string[] {
  const problems: string[] = [];
  for (const cas of text.match(CAS_IN_TEXT) ?? []) {
    const expected = casCheckDigit(cas)!;
    if (Number(cas.slice(-1)) !== expected)
      problems.push(
        `CAS ${cas} fails its check digit (the other digits call for ${expected}): check the number`,
      );
  }
  if (problems.length === 0 && text.trim() !== '' && !CAS_ANYWHERE.test(text))
    problems.push('Enter a CAS number such as 7732-18-5');
  return problems;
}
