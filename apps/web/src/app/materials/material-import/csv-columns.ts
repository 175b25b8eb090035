import { MATERIAL_CSV_COLUMNS } from '@batchproof/shared';

/** A column header of the materials CSV. */
export type MaterialCsvColumn = (typeof MATERIAL_CSV_COLUMNS)[number];

/** What the material form calls the field each CSV column holds. */
export const CSV_COLUMN_LABELS: Readonly<Record<MaterialCsvColumn, string>> = {
  tradeName: 'Trade name',
  inci: 'INCI name',
  usName: 'US label name',
  cas: 'CAS number',
  ec: 'EC number',
  functions: 'Functions',
  category: 'Category',
  supplier: 'Supplier',
  colourIndex: 'Colour Index number',
  nano: 'Nanomaterial',
  notes: 'Notes',
  components: 'Blend components',
  ifraCertificate: 'IFRA conformity certificate',
  allergenDeclaration: 'Allergen declaration',
  weightPerVolume: 'Weight per volume',
  calibrations: 'Measured calibrations',
};

const isColumn = (key: string): key is MaterialCsvColumn =>
  (MATERIAL_CSV_COLUMNS as readonly string[]).includes(key);

/**
 * Where a preview message belongs, in the screen's words with the file's header beside them
 * ("Trade name (column tradeName)"), so the maker finds the cell in the spreadsheet.
 */
export function columnLabel(key: string): string {
  if (isColumn(key)) return `${CSV_COLUMN_LABELS[key]} (column ${key})`;
  if (key === '_form') return 'This row';
  return `Column ${key}`;
}
