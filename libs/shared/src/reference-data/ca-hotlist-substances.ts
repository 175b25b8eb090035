import type { RestrictedSubstance } from './restricted-substance-row';

/**
 * Health Canada Cosmetic Ingredient Hotlist entries for the preservatives and prohibited fragrance materials
 * that the EU list covers (see eu-restricted-substances.ts). Only entries whose Hotlist wording was found are
 * here; sources and gaps are in docs/reference-sources/restricted-substances.md.
 *
 * Not found, so no row (do not assume the EU rule applies in Canada): methylisothiazolinone alone,
 * parabens, salicylic acid, phenoxyethanol, butylphenyl methylpropional, HICC, atranol, chloroatranol.
 */
export const caHotlistSubstances: readonly RestrictedSubstance[] = [
  {
    id: 'ca-hotlist-methylisothiazolinone-methylchloroisothiazolinone',
    list: 'CA Hotlist',
    name: 'Methylisothiazolinone / Methylchloroisothiazolinone, in combination',
    source:
      'Health Canada, Cosmetic Ingredient Hotlist (December 2015), entry "Methylisothiazolinone / Methylchloroisothiazolinone, in combination"',
    status: 'C2',
    forms: [
      { inci: 'Methylchloroisothiazolinone (and) Methylisothiazolinone', cas: '55965-84-9' },
      { inci: 'Methylchloroisothiazolinone', cas: '26172-55-4' },
    ],
    notAllowedIn: 'leave-on',
    limits: [
      {
        scope: 'rinse-off',
        maxPercent: 0.0015,
        wording:
          'Maximum permitted level in rinse-off products: 0.0015% (15ppm) in rinse-off products only',
      },
    ],
    conditions: ['Prohibited in leave-on products'],
    note: 'Entry wording quoted from the December 2015 Hotlist by two testing-laboratory notices (the Hotlist lists CAS 26172-55-4 and 2682-20-4). Leave-on products had to be off sale by 31 Dec 2016 (consultancy note, C2). Later Hotlist versions (last updates seen: Aug 2022, Feb 2025, Aug 2025) were not read for this entry.',
  },
];
