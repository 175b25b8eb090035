import { MATERIAL_CATEGORIES, MATERIAL_CATEGORY_LABELS } from '@batchproof/shared';

/** What each material category is called on screen (shared: the CSV import reads these words too). */
export const CATEGORY_LABELS = MATERIAL_CATEGORY_LABELS;

/** Every category with its label, in the shared order, for pickers. */
export const CATEGORY_OPTIONS = MATERIAL_CATEGORIES.map((category) => ({
  category,
  label: CATEGORY_LABELS[category],
}));
