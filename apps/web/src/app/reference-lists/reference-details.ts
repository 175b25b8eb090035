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
  ['conditions', 'Conditions'],
];

/** EU Annex IV fields of application, in words. */
const FIELDS: Record<string, string> = {
  all: 'all products',
  'not-eye': 'not eye products',
  'not-mucous-membranes': 'not on mucous membranes',
  'rinse-off-only': 'rinse-off products only',
};

/** A US listing's permitted uses, in words. */
function usesInWords(uses: unknown): string {
  if (!uses || typeof uses !== 'object') return '';
  const u = uses as Record<string, unknown>;
  const words: string[] = [];
  if (u['generally']) words.push('cosmetics generally');
  else if (u['externallyApplied']) words.push('externally applied only');
  if (u['eyeArea']) words.push('eye area');
  if (typeof u['lipProductsMaxPercent'] === 'number') {
    words.push(`lip products up to ${u['lipProductsMaxPercent']} %`);
  }
  if (Array.isArray(u['restrictedTo']) && u['restrictedTo'].length) {
    words.push(`only ${u['restrictedTo'].join(', ')}`);
  }
  return words.join('; ');
}

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
  const details = DETAIL_KEYS.flatMap(([key, label]) => {
    const value =
      key === 'field' ? (FIELDS[String(data[key])] ?? show(data[key])) : show(data[key]);
    return value ? [{ label, value }] : [];
  });
  const uses = usesInWords(data['uses']);
  return uses ? [...details, { label: 'Permitted', value: uses }] : details;
}
