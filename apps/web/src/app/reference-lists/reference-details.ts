/** Columns of a row's own data worth showing in the list, by key, with their headings. */
const DETAIL_KEYS: [key: string, label: string][] = [
  ['colourIndex', 'CI'],
  ['cas', 'CAS'],
  ['cfrSection', 'CFR'],
  ['annexRef', 'Annex ref.'],
  ['field', 'Field of application'],
  ['market', 'Market'],
  ['appliesTo', 'Applies to'],
  ['text', 'Text'],
  ['certificationRequired', 'Certified batches'],
  ['maxPercent', 'Maximum %'],
];

function show(value: unknown): string {
  if (value === null || value === undefined || value === '') return '';
  if (Array.isArray(value)) return value.map(show).filter(Boolean).join(', ');
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value === 'object') return '';
  return String(value);
}

/** The short facts of a reference row (CI, CAS, CFR section …) as label/value pairs. */
export function referenceDetails(
  data: Record<string, unknown>,
): { label: string; value: string }[] {
  return DETAIL_KEYS.flatMap(([key, label]) => {
    const value = show(data[key]);
    return value ? [{ label, value }] : [];
  });
}
