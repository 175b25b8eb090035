import { MATERIAL_CATEGORIES, type MaterialCategory } from '@batchproof/shared';

/** What each material category is called on screen. */
export const CATEGORY_LABELS: Readonly<Record<MaterialCategory, string>> = {
  base: 'Base',
  acid: 'Acid',
  binder: 'Binder',
  hardener: 'Hardener',
  oil: 'Oil',
  butter: 'Butter',
  emulsifier: 'Emulsifier',
  surfactant: 'Surfactant',
  colourant: 'Colourant',
  fragrance: 'Fragrance',
  'essential-oil': 'Essential oil',
  preservative: 'Preservative',
  additive: 'Additive',
  other: 'Other',
};

/** Every category with its label, in the shared order, for pickers. */
export const CATEGORY_OPTIONS = MATERIAL_CATEGORIES.map((category) => ({
  category,
  label: CATEGORY_LABELS[category],
}));
