import type * as z from 'zod';
import {
  MATERIAL_CATEGORIES,
  MATERIAL_CATEGORY_LABELS,
  type MaterialCategory,
} from '@batchproof/shared';

/**
 * The words of the materials CSV's messages: problems keyed by the file's column headers, said
 * in the screen's words. (A file that is not UTF-8 is refused in core/csv-upload.ts.)
 */

/** Case, spaces, dashes and underscores folded, so "Essential oil" and "essential-oil" meet. */
const fold = (text: string) =>
  text
    .trim()
    .toLowerCase()
    .replace(/[\s_-]+/g, ' ');

const categoryByWords = new Map<string, MaterialCategory>(
  MATERIAL_CATEGORIES.flatMap((c) => [
    [fold(c), c],
    [fold(MATERIAL_CATEGORY_LABELS[c]), c],
  ]),
);
const categoryWords = MATERIAL_CATEGORIES.map((c) => MATERIAL_CATEGORY_LABELS[c]).join(', ');

/**
 * The category a cell names, by its key (`essential-oil`) or as the screen shows it
 * (`Essential oil`), ignoring case; anything else is passed on for the schema to refuse.
 */
export function categoryFromCell(cell: string): string {
  return categoryByWords.get(fold(cell)) ?? cell;
}

/** Why a category cell was refused, naming the categories as the screen does. */
function categoryMessage(cell: string) {
  const shown = cell.length > 60 ? `${cell.slice(0, 59)}…` : cell;
  return cell
    ? `"${shown}" is not a category. Write one of: ${categoryWords}`
    : `Choose a category: ${categoryWords}`;
}

/** Fields of the material schema held in a column of another name. */
const COLUMN_OF_FIELD: Readonly<Record<string, string>> = { supplierId: 'supplier' };

/** Where inside a JSON cell a problem lies, in words: `Entry 2, inci`. */
const placeInCell = (path: readonly PropertyKey[]) =>
  path.map((p) => (typeof p === 'number' ? `Entry ${p + 1}` : String(p))).join(', ');

/**
 * A row's schema problems keyed by the file's column header (`components`, not
 * `components.1.inci`), each message saying where inside a JSON cell it lies.
 */
export function columnErrors(error: z.ZodError, categoryCell: string) {
  const out: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const [head, ...rest] = issue.path;
    const field = head === undefined ? '_form' : String(head);
    const column = COLUMN_OF_FIELD[field] ?? field;
    const message =
      column === 'category'
        ? categoryMessage(categoryCell)
        : rest.length > 0
          ? `${placeInCell(rest)}: ${issue.message}`
          : issue.message;
    const list = (out[column] ??= []);
    if (!list.includes(message)) list.push(message);
  }
  return out;
}
