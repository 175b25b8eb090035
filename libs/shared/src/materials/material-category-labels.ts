import type { MaterialCategory } from './material-schema';

/**
 * What each material category is called on screen. The materials CSV accepts these words as
 * well as the keys (`essential-oil`), and its messages name categories this way.
 */
export const MATERIAL_CATEGORY_LABELS: Readonly<Record<MaterialCategory, string>> = {
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
