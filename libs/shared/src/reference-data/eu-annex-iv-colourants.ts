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
  /**
   * The entry for the nanomaterial form; it applies only to ingredients marked nano, and the
   * ordinary entry only to the rest (Art. 19(1)(g): nanomaterials are listed with "(nano)").
   */
  readonly nano?: boolean;
  /**
   * The Annex IV condition for use in lipstick and other lip products, when the entry sets one:
   * the maximum in the lip product (percent) and the condition's wording.
   */
  readonly lipstick?: { maxPercent?: number; wording: string };
}

const ANNEX_IV = 'Regulation (EC) No 1223/2009, Annex IV';
/**
 * The consolidated text read for this list: CELEX 02009R1223-20260518 (consolidated version of
 * 18 May 2026), as extracted into a public repository (docs/reference-sources/colourants-and-names.md).
 */
const CONSOLIDATED = `${ANNEX_IV} (consolidated text of 18 May 2026)`;
/** Wording Annex IV uses for the many food-colour purity conditions. */
const purity = (eNumber: string) =>
  `Purity criteria as set out in Commission Directive 95/45/EC (${eNumber})`;
/** Annex IV condition shared by several xanthene entries (refs 75, 76, 78, 79). */
const XANTHENE_PURITY =
  'Not more than 1 % 2-(6-hydroxy-3-oxo-3H-xanthen-9-yl) benzoic acid and 2 % 2-(bromo-6-hydroxy-3-oxo-3H-xanthen-9-yl) benzoic acid';
/** Annex IV condition on the ordinary and nano carbon black entries (refs 126, 126a). */
const CARBON_BLACK_PURITY =
  'Purity > 97 %, with the following impurity profile: ash content ≤ 0,15 %, total sulphur ≤ 0,65 %, total PAH ≤ 500 ppb and benzo(a)pyrene ≤ 5 ppb, dibenz(a,h)anthracene ≤ 5 ppb, total As ≤ 3 ppm, total Pb ≤ 10 ppm, total Hg ≤ 1 ppm';
const NOT_INHALED =
  "Not to be used in applications that may lead to exposure of the end user's lungs by inhalation";

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
    nano?: boolean;
    lipstick?: { maxPercent?: number; wording: string };
  } = {},
): EuAnnexIvColourant {
  const { source, nano, ...rest } = extra;
  const key = colourIndex || name.toLowerCase().replace(/[^a-z0-9]+/g, '-');
  return {
    id: `eu-ci-${key}${nano === true ? '-nano' : ''}`,
    colourIndex,
    name,
    field,
    source: source ?? (status === 'M' ? ANNEX_IV : CONSOLIDATED),
    status,
    ...(nano === true ? { nano: true } : {}),
    ...rest,
  };
}

/**
 * Annex IV entries for colourants bath and body makers use. Field, maximum and conditions were read
 * in the consolidated text of 18 May 2026; an empty column (g) "product type, body parts" is `all`.
 * A colorant includes its salts and lakes (Annex IV preamble), so CI 15850 covers 15850:1.
 * Rows marked `M` warn but never block. Mica (CI 77019) has no Annex IV entry and is not listed here.
 * A nano row precedes the ordinary row of the same CI, so a lookup keyed on CI alone that keeps the
 * last row it sees lands on the ordinary entry; only an ingredient marked nano takes the nano row.
 */
export const euAnnexIvColourants: readonly EuAnnexIvColourant[] = [
  row('77491', 'Iron oxide red', 'all', 'C', { annexRef: '135', conditions: purity('E 172') }),
  row('77492', 'Iron oxide yellow', 'all', 'C', { annexRef: '136', conditions: purity('E 172') }),
  row('77499', 'Iron oxide black', 'all', 'C', { annexRef: '137', conditions: purity('E 172') }),
  row('77891', 'Titanium dioxide', 'all', 'C', {
    annexRef: '143',
    conditions: `${purity('E 171')}; titanium dioxide in powder form containing 1 % or more of particles with aerodynamic diameter ≤ 10 μm, to be used in compliance with Annex III, No 321`,
    note: 'Annex IV has no separate nano entry for titanium dioxide; its footnote sends UV-filter use to Annex VI, No 27.',
  }),
  row('77007', 'Ultramarines (Annex IV chemical name: lazurite)', 'all', 'C', { annexRef: '120' }),
  row('77288', 'Chromium oxide green (chromium (III) oxide)', 'all', 'C', {
    annexRef: '129',
    conditions: 'Free from chromate ion',
  }),
  row('77289', 'Chromium hydroxide green (chromium (III) hydroxide)', 'all', 'C', {
    annexRef: '130',
    conditions: 'Free from chromate ion',
  }),
  row('77742', 'Manganese violet (ammonium manganese(3+) diphosphate)', 'all', 'C', {
    annexRef: '140',
  }),
  row('77510', 'Ferric (ammonium) ferrocyanide', 'all', 'C', {
    annexRef: '138',
    conditions: 'Free from cyanide ions',
    note: 'Annex IV names the entry "Ferric Ammonium Ferrocyanide"; makers label both Prussian blue grades CI 77510.',
  }),
  row('77163', 'Bismuth oxychloride (bismuth chloride oxide)', 'all', 'C', { annexRef: '123' }),
  row('77947', 'Zinc oxide', 'all', 'C', {
    annexRef: '144',
    conditions:
      "Not to be used in applications that may lead to exposure of the end-user's lungs by inhalation.",
    note: 'Footnote: for use as a UV filter see Annex VI, No 30 and No 30a.',
  }),
  row('77000', 'Aluminium', 'all', 'C', { annexRef: '117', conditions: purity('E 173') }),
  row('75470', 'Carmine', 'all', 'C', { annexRef: '115', conditions: purity('E 120') }),
  row('75120', 'Annatto', 'all', 'C', { annexRef: '109', conditions: purity('E 160b') }),
  row('40800', 'Beta-carotene', 'all', 'C', { annexRef: '55', conditions: purity('E160a') }),
  row('75810', 'Chlorophylls', 'all', 'C', {
    annexRef: '116',
    conditions: purity('E 140, E 141'),
  }),
  row('75300', 'Curcumin', 'all', 'C', { annexRef: '114', conditions: purity('E 100') }),
  row('', 'Caramel', 'all', 'C', { annexRef: '146', conditions: purity('E 150a-d') }),
  row('42090', 'Brilliant Blue FCF (US FD&C Blue No. 1)', 'all', 'C', {
    annexRef: '63',
    conditions: purity('E 133'),
  }),
  row('16035', 'Allura Red AC (US FD&C Red No. 40)', 'all', 'C', {
    annexRef: '32',
    conditions: purity('E 129'),
  }),
  row('19140', 'Tartrazine (US FD&C Yellow No. 5)', 'all', 'C', {
    annexRef: '44',
    conditions: purity('E 102'),
  }),
  row('15985', 'Sunset Yellow FCF (US FD&C Yellow No. 6)', 'all', 'C', {
    annexRef: '31',
    conditions: purity('E 110'),
  }),
  row('17200', 'Acid Fuchsine (US D&C Red No. 33)', 'all', 'C', { annexRef: '37' }),
  row('15850', 'Lithol Rubine (US D&C Red No. 6/7)', 'all', 'C', {
    annexRef: '27',
    conditions: purity('E 180'),
  }),
  row('45370', 'Dibromofluorescein (US D&C Orange No. 5)', 'all', 'C', {
    annexRef: '75',
    conditions: XANTHENE_PURITY,
  }),
  row('45380', 'Eosine (US D&C Red No. 21/22)', 'all', 'C', {
    annexRef: '76',
    conditions: XANTHENE_PURITY,
  }),
  row('45396', 'Dinitrofluorescein', 'all', 'C', {
    annexRef: '77',
    lipstick: { maxPercent: 1, wording: 'Only in free acid form, when used in lip products' },
    note: 'The only xanthene entry with a lip-product condition: "1 %, when used in lip products" (column h).',
  }),
  row('45405', 'Phloxine (dipotassium salt)', 'not-eye', 'C', {
    annexRef: '78',
    conditions: XANTHENE_PURITY,
  }),
  row('45410', 'Phloxine B (US D&C Red No. 27/28)', 'all', 'C', {
    annexRef: '79',
    conditions: XANTHENE_PURITY,
  }),
  row('45430', 'Erythrosine (US FD&C Red No. 3)', 'all', 'C', {
    annexRef: '80',
    conditions: purity('E 127'),
  }),
  row('47005', 'Quinoline Yellow (US D&C Yellow No. 10 pairing from memory)', 'all', 'C', {
    annexRef: '82',
    conditions: purity('E 104'),
  }),
  row('73360', 'Thioindigo red (US D&C Red No. 30)', 'all', 'C', { annexRef: '100' }),
  row('60730', 'Ext. D&C Violet No. 2', 'not-mucous-membranes', 'C', { annexRef: '90' }),
  row('60725', 'D&C Violet No. 2', 'all', 'C', { annexRef: '89' }),
  row('61570', 'D&C Green No. 5', 'all', 'C', { annexRef: '92' }),
  row('61565', 'D&C Green No. 6', 'all', 'C', { annexRef: '91' }),
  row('18050', 'Red (ref 38)', 'not-mucous-membranes', 'C', {
    annexRef: '38',
    conditions: purity('E 128'),
  }),
  row('45100', 'Red (ref 71)', 'rinse-off-only', 'C', { annexRef: '71' }),
  row('45220', 'Red (ref 73)', 'rinse-off-only', 'C', { annexRef: '73' }),
  row('18736', 'Red (ref 41)', 'rinse-off-only', 'C', { annexRef: '41' }),
  row('24790', 'Red (ref 50)', 'rinse-off-only', 'C', { annexRef: '50' }),
  row('21100', 'Yellow (ref 47)', 'rinse-off-only', 'C', {
    annexRef: '47',
    conditions: "Maximum 3,3'-dimethylbenzidine concentration in the colouring agent: 5 ppm",
  }),
  row('21108', 'Yellow (ref 48)', 'rinse-off-only', 'C', {
    annexRef: '48',
    conditions: "Maximum 3,3'-dimethylbenzidine concentration in the colouring agent: 5 ppm",
  }),
  row('10006', 'Green', 'rinse-off-only', 'C', { annexRef: '1' }),
  row('10316', 'Yellow (US Ext. D&C Yellow No. 7)', 'not-eye', 'C', { annexRef: '3' }),
  row('12085', 'Red (US D&C Red No. 36)', 'all', 'C', { annexRef: '9', maxPercent: 3 }),
  // Nano row first: see the list's doc comment.
  row('77266', 'Carbon black (nano)', 'all', 'C', {
    annexRef: '126a',
    nano: true,
    maxPercent: 10,
    conditions: `${NOT_INHALED}. Only nanomaterials having the following characteristics are allowed: ${CARBON_BLACK_PURITY}; primary particle size ≥ 20 nm`,
  }),
  row('77266', 'Carbon black', 'all', 'C', { annexRef: '126', conditions: CARBON_BLACK_PURITY }),
];
