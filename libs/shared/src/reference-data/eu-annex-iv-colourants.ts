import type { ReferenceRow, ReferenceStatus } from './reference-row';

/**
 * Annex IV column (g) "product type, body parts", in the wording of the ECHA list: all cosmetic
 * products / not eye products / not products applied to mucous membranes / rinse-off products only.
 */
export type EuFieldOfApplication = 'all' | 'not-eye' | 'not-mucous-membranes' | 'rinse-off-only';

/** One colourant allowed by Annex IV of Regulation (EC) No 1223/2009. */
export interface EuAnnexIvColourant extends ReferenceRow {
  /** Colour Index number without salt/lake suffix (an entry covers its salts and lakes); empty for name-only entries. */
  readonly colourIndex: string;
  /** Glossary denomination when the entry has no CI number, or a helpful common name. */
  readonly name: string;
  /** Annex IV reference number, when known. */
  readonly annexRef?: string;
  /** Where it may be used. */
  readonly field: EuFieldOfApplication;
  /** Maximum concentration in the ready-for-use preparation, percent, when set. */
  readonly maxPercent?: number;
  /** Other conditions (purity and the like) that Batchproof shows but cannot check. */
  readonly conditions?: string;
  /** Whether the UK's retained Annex IV differs for this row (it follows the EU unless this is set). */
  readonly ukDiffers?: boolean;
}

const ECHA = 'Regulation (EC) No 1223/2009, Annex IV (ECHA list)';
const ANNEX_IV = 'Regulation (EC) No 1223/2009, Annex IV';

function row(
  colourIndex: string,
  name: string,
  field: EuFieldOfApplication,
  status: ReferenceStatus,
  extra: {
    annexRef?: string;
    maxPercent?: number;
    conditions?: string;
    source?: string;
    note?: string;
  } = {},
): EuAnnexIvColourant {
  const { source, ...rest } = extra;
  return {
    id: `eu-ci-${colourIndex || name.toLowerCase().replace(/[^a-z0-9]+/g, '-')}`,
    colourIndex,
    name,
    field,
    source: source ?? (status === 'C' ? ECHA : ANNEX_IV),
    status,
    ...rest,
  };
}

/**
 * Annex IV entries for colourants bath and body makers use (regulatory sources file, sections 4 and 15).
 * A colorant includes its salts and lakes (Annex IV preamble), so CI 15850 covers 15850:1.
 * Rows marked `M` warn but never block.
 */
export const euAnnexIvColourants: readonly EuAnnexIvColourant[] = [
  row('77491', 'Iron oxide red', 'all', 'C', {
    annexRef: '135',
    conditions: 'Purity criteria as for E 172',
  }),
  row('77492', 'Iron oxide yellow', 'all', 'C2'),
  row('77499', 'Iron oxide black', 'all', 'C2'),
  row('77891', 'Titanium dioxide', 'all', 'C2', {
    note: 'The nano form has a separate entry with its own conditions (from memory).',
  }),
  row('77007', 'Ultramarines', 'all', 'C2'),
  row('77288', 'Chromium oxide green', 'all', 'M', { conditions: 'Free from chromate ion' }), // from memory
  row('77289', 'Chromium hydroxide green', 'all', 'M', { conditions: 'Free from chromate ion' }), // from memory
  row('77742', 'Manganese violet', 'all', 'M', {
    annexRef: '140',
    note: 'Entry number C2; field of application from memory.',
  }), // from memory
  row('77510', 'Ferric ferrocyanide', 'all', 'M', { conditions: 'Free from cyanide ions' }), // from memory
  row('77163', 'Bismuth oxychloride', 'all', 'M'), // from memory
  row('77019', 'Mica', 'all', 'M'), // from memory
  row('77947', 'Zinc oxide', 'all', 'M', {
    annexRef: '144',
    note: 'Entry number C2; field of application from memory.',
  }), // from memory
  row('75470', 'Carmine', 'all', 'C', {
    annexRef: '115',
    conditions: 'Purity criteria as for E 120',
    note: 'CI number from memory.',
  }),
  row('40800', 'Beta-carotene', 'all', 'C', {
    annexRef: '55',
    conditions: 'Purity criteria as for E 160a',
  }),
  row('75810', 'Chlorophylls', 'all', 'C', {
    annexRef: '116',
    conditions: 'Purity criteria as for E 140/E 141',
    note: 'CI number from memory.',
  }),
  row('75300', 'Curcumin', 'all', 'C', {
    annexRef: '114',
    conditions: 'Purity criteria as for E 100',
    note: 'CI number from memory.',
  }),
  row('', 'Caramel', 'all', 'C', { conditions: 'Purity criteria as for E 150a-d' }),
  row('42090', 'Brilliant Blue FCF', 'all', 'M', { conditions: 'Purity criteria as for E 133' }), // from memory
  row('16035', 'Allura Red AC', 'all', 'C', {
    annexRef: '32',
    conditions: 'Purity criteria as for E 129',
  }),
  row('19140', 'Tartrazine', 'all', 'C', {
    annexRef: '44',
    conditions: 'Purity criteria as for E 102',
  }),
  row('15985', 'Sunset Yellow FCF', 'all', 'C', {
    annexRef: '31',
    conditions: 'Purity criteria as for E 110',
  }),
  row('17200', 'Acid Fuchsine (US D&C Red No. 33, pairing from memory)', 'all', 'C', {
    annexRef: '37',
  }),
  row('15850', 'Lithol Rubine (US D&C Red No. 6/7)', 'all', 'C', {
    annexRef: '27',
    conditions: 'Purity criteria as for E 180',
  }),
  row('45370', 'Dibromofluorescein (US D&C Orange No. 5)', 'all', 'C', {
    conditions:
      'Not more than 1 % 2-(6-hydroxy-3-oxo-3H-xanthen-9-yl) benzoic acid; not more than 2 % 2-(bromo-6-hydroxy-3-oxo-3H-xanthen-9-yl) benzoic acid',
    note: 'Conditions confirmed; which Annex IV reference (75 or 76) belongs to this CI is from memory.',
  }),
  row('45380', 'Eosine (US D&C Red No. 21/22)', 'all', 'C', {
    conditions:
      'Not more than 1 % 2-(6-hydroxy-3-oxo-3H-xanthen-9-yl) benzoic acid; not more than 2 % 2-(bromo-6-hydroxy-3-oxo-3H-xanthen-9-yl) benzoic acid',
    note: 'Conditions confirmed; which Annex IV reference (75 or 76) belongs to this CI is from memory.',
  }),
  row('45410', 'Phloxine B (US D&C Red No. 27/28)', 'all', 'M', {
    note: 'Lipstick condition from memory, not checked.',
  }), // from memory
  row('47005', 'Quinoline Yellow (US D&C Yellow No. 10 pairing from memory)', 'all', 'M', {
    conditions: 'Purity criteria as for E 104',
  }), // from memory
  row('60730', 'Ext. D&C Violet No. 2', 'not-mucous-membranes', 'C', { annexRef: '90' }),
  row('60725', 'D&C Violet No. 2', 'not-mucous-membranes', 'M'), // from memory
  row('61570', 'D&C Green No. 5', 'all', 'C2'),
  row('61565', 'D&C Green No. 6', 'all', 'C2'),
  row('18050', 'Red (ref 38)', 'not-mucous-membranes', 'C', {
    annexRef: '38',
    conditions: 'Purity criteria as for E 128',
  }),
  row('45100', 'Red (ref 71)', 'rinse-off-only', 'C', { annexRef: '71' }),
  row('45220', 'Red (ref 73)', 'rinse-off-only', 'C', { annexRef: '73' }),
  row('18736', 'Red (ref 41)', 'rinse-off-only', 'C', { annexRef: '41' }),
  row('24790', 'Red (ref 50)', 'rinse-off-only', 'C', { annexRef: '50' }),
  row('21100', 'Yellow (ref 47)', 'rinse-off-only', 'C', {
    annexRef: '47',
    conditions: "Maximum 3,3'-dimethylbenzidine concentration in the colouring agent is 5 ppm",
  }),
  row('21108', 'Yellow (ref 48)', 'rinse-off-only', 'C', {
    annexRef: '48',
    conditions: "Maximum 3,3'-dimethylbenzidine concentration in the colouring agent is 5 ppm",
  }),
  row('10006', 'Green', 'rinse-off-only', 'C', {
    source: `${ANNEX_IV} (Greek and Serbian official versions)`,
  }),
  row('10316', 'Yellow (US Ext. D&C Yellow No. 7)', 'not-eye', 'C', {
    source: `${ANNEX_IV} (Greek and Serbian official versions)`,
  }),
  row('12085', 'Red (US D&C Red No. 36)', 'all', 'C2', {
    maxPercent: 3,
    source: 'Directive 76/768/EEC Annex IV (old text); current 1223/2009 entry from memory',
    note: '3 % maximum in the finished product per the old Directive text.',
  }),
  row('77266', 'Carbon black (nano)', 'all', 'C', {
    maxPercent: 10,
    conditions:
      "Not to be used in applications that may lead to exposure of the end user's lungs by inhalation; purity > 97 %; primary particle size ≥ 20 nm",
    source: 'Regulation (EC) No 1223/2009, Annex IV (ECHA term 100.028.321)',
    note: 'This is the nano entry; the field of application of non-nano carbon black is from memory.',
  }),
];
