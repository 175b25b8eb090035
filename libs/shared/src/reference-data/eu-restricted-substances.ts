import type { RestrictedSubstance } from './restricted-substance-row';

/**
 * Restricted and prohibited substances of Regulation (EC) No 1223/2009 that reach small-batch bath and body
 * makers: Annex V preservatives they buy in ready-made blends, Annex III entries with a numeric maximum they
 * meet in fragrances or actives, and Annex II prohibitions that came in through fragrance materials.
 *
 * Where each value was read, and how sure we are, is in docs/reference-sources/restricted-substances.md.
 * Status: `C` read in the primary text (ECHA Annex V listing, a CosIng Annex export, legislation.gov.uk copy
 * of the regulation); `C2` read in a secondary source quoting it; `M` not confirmed (marked `// from memory`).
 *
 * Annex V maxima apply when the substance is used as a preservative (Art. 14(1)(d)); the same substance used
 * for another purpose falls under Annex III where it has an entry there (salicylic acid: Annex III entry 98).
 *
 * `asFactor` converts a form's weight to the weight the limit is expressed in ("as acid"): molar mass of the
 * acid (times the number of acid units for a divalent salt) over molar mass of the form, standard atomic
 * weights C 12.011, H 1.008, O 15.999, N 14.007, Na 22.990, K 39.098, Mg 24.305, Ca 40.078; 4 significant
 * figures.
 */

const ANNEX_V = 'Regulation (EC) No 1223/2009, Annex V';
const ANNEX_III = 'Regulation (EC) No 1223/2009, Annex III';
const ANNEX_II = 'Regulation (EC) No 1223/2009, Annex II';

/** Group for the combined 0,8 % (as acid) maximum shared by Annex V entries 12 and 12a. */
const PARABEN_GROUP = 'eu-annex-v-parabens-12-12a';
const PARABEN_GROUP_LIMIT = {
  scope: 'all',
  maxPercent: 0.8,
  wording:
    '0,8 % (as acid) for mixtures of substances mentioned in entry 12 and 12a (4-hydroxybenzoic acid, its methyl and ethyl esters, propyl and butyl 4-hydroxybenzoate, and their salts)',
} as const;

/**
 * UK status CALC: derived from the confirmed EU entry and the rule that retained EU law is the text as
 * it stood on 31 December 2020 (European Union (Withdrawal) Act 2018, s. 3).
 */
const UK_RETAINED_INFERRED =
  'Derived, not read: the EU entry predates IP completion day (31 Dec 2020), so GB retained it; no GB amendment to this entry was found, but the GB annex entry itself was not read.';

export const euRestrictedSubstances: readonly RestrictedSubstance[] = [
  // ---------------------------------------------------------------- Annex V: preservatives
  {
    id: 'eu-annex-v-1-benzoic-acid',
    list: 'EU Annex V',
    entryRef: '1',
    name: 'Benzoic acid and its sodium salt',
    source: `${ANNEX_V}, entry 1`,
    status: 'C',
    forms: [
      { inci: 'Benzoic Acid', cas: '65-85-0', asFactor: 1 },
      {
        inci: 'Sodium Benzoate',
        cas: '532-32-1',
        asFactor: 0.8475,
        formula: 'C7H5NaO2',
        asFormula: 'C7H6O2',
      },
    ],
    expressedAs: 'acid',
    limits: [
      { scope: 'rinse-off', maxPercent: 2.5, wording: 'Rinse-off products, except oral products' },
      { scope: 'leave-on', maxPercent: 0.5, wording: 'Leave-on products' },
    ],
    conditions: ['Oral products: 1,7 % (acid)'],
    note: 'Other salts (potassium, calcium, …) and the esters are entry 1a, not this entry.',
    ukStatus: 'C',
    ukNote:
      'GB Annex V (legislation.gov.uk, version of 3 Sep 2017) carries entry 1 with the same three maxima.',
  },
  {
    id: 'eu-annex-v-1a-benzoic-acid-other-salts-esters',
    list: 'EU Annex V',
    entryRef: '1a',
    name: 'Salts of benzoic acid other than that listed under reference number 1 and esters of benzoic acid',
    source: `${ANNEX_V}, entry 1a`,
    status: 'C',
    forms: [
      {
        inci: 'Potassium Benzoate',
        cas: '582-25-2',
        asFactor: 0.7623,
        formula: 'C7H5KO2',
        asFormula: 'C7H6O2',
      },
      {
        inci: 'Calcium Benzoate',
        cas: '2090-05-3',
        asFactor: 0.8652,
        formula: 'C14H10CaO4',
        asFormula: '(C7H6O2)2',
      },
      {
        inci: 'Ammonium Benzoate',
        cas: '1863-63-4',
        asFactor: 0.8776,
        formula: 'C7H9NO2',
        asFormula: 'C7H6O2',
      },
    ],
    expressedAs: 'acid',
    limits: [{ scope: 'all', maxPercent: 0.5, wording: '0,5 % (acid)' }],
    note: 'The entry also lists magnesium and MEA benzoate and the methyl, ethyl, propyl, butyl, isobutyl, isopropyl and phenyl esters; only the salts a maker buys as preservatives are keyed here (benzoate esters are also fragrance materials, where Annex V does not apply).',
    ukStatus: 'C',
    ukNote:
      'GB Annex V (legislation.gov.uk, version of 3 Sep 2017) carries entry 1a, 0,5 % (acid).',
  },
  {
    id: 'eu-annex-v-3-salicylic-acid',
    list: 'EU Annex V',
    entryRef: '3',
    name: 'Salicylic acid and its salts',
    source: `${ANNEX_V}, entry 3`,
    status: 'C',
    forms: [
      { inci: 'Salicylic Acid', cas: '69-72-7', asFactor: 1 },
      {
        inci: 'Sodium Salicylate',
        cas: '54-21-7',
        asFactor: 0.8627,
        formula: 'C7H5NaO3',
        asFormula: 'C7H6O3',
      },
      {
        inci: 'Potassium Salicylate',
        cas: '578-36-9',
        asFactor: 0.7838,
        formula: 'C7H5KO3',
        asFormula: 'C7H6O3',
      },
      {
        inci: 'Calcium Salicylate',
        cas: '824-35-1',
        asFactor: 0.8789,
        formula: 'C14H10CaO6',
        asFormula: '(C7H6O3)2',
      },
      {
        inci: 'Magnesium Salicylate',
        cas: '18917-89-0',
        asFactor: 0.9253,
        formula: 'C14H10MgO6',
        asFormula: '(C7H6O3)2',
      },
      {
        inci: 'MEA-Salicylate',
        cas: '59866-70-5',
        asFactor: 0.6934,
        formula: 'C9H13NO4',
        asFormula: 'C7H6O3',
      },
      {
        inci: 'TEA-Salicylate',
        cas: '2174-16-5',
        asFactor: 0.4807,
        formula: 'C13H21NO6',
        asFormula: 'C7H6O3',
      },
    ],
    expressedAs: 'acid',
    limits: [{ scope: 'all', maxPercent: 0.5, wording: '0,5 % (acid)' }],
    conditions: [
      'Not to be used in products for children under 3 years of age (the 2015 CosIng export adds "except for shampoos"; the current ECHA listing read does not show that exception)',
      'Not to be used in oral products',
      "Not to be used in applications that may lead to exposure of the end-user's lungs by inhalation",
      'Label warning applies solely to products which might be used for children under 3 years of age',
      'For use other than as a preservative see Annex III, entry 98',
    ],
    labelWarning: 'Not to be used for children under 3 years of age',
    labelWarningFor:
      'products which might be used for children under three years of age and which remain in prolonged contact with the skin',
    amendedBy: 'Regulation (EU) 2019/1966',
    placingFrom: '2020-05-01',
    availableFrom: '2020-05-01',
    note: 'Maximum, restrictions and warning read in the ECHA Annex V listing (as amended by 2022/1531). Whether "except for shampoos" survives the 2019/1966 text is unresolved. The 2019/1966 date (1 May 2020, no sell-through period) is C2 (a laboratory news note).',
    ukStatus: 'C2',
    ukNote:
      'legislation.gov.uk carries Regulation (EU) 2019/1966 (adopted before IP completion day); the GB entry 3 text itself was not read.',
  },
  {
    id: 'eu-annex-v-4-sorbic-acid',
    list: 'EU Annex V',
    entryRef: '4',
    name: 'Hexa-2,4-dienoic acid and its salts',
    source: `${ANNEX_V}, entry 4`,
    status: 'C',
    forms: [
      { inci: 'Sorbic Acid', cas: '110-44-1', asFactor: 1 },
      {
        inci: 'Potassium Sorbate',
        cas: '24634-61-5',
        asFactor: 0.7464,
        formula: 'C6H7KO2',
        asFormula: 'C6H8O2',
      },
      {
        inci: 'Sodium Sorbate',
        cas: '7757-81-5',
        asFactor: 0.8361,
        formula: 'C6H7NaO2',
        asFormula: 'C6H8O2',
      },
      {
        inci: 'Calcium Sorbate',
        cas: '7492-55-9',
        asFactor: 0.8549,
        formula: 'C12H14CaO4',
        asFormula: '(C6H8O2)2',
      },
    ],
    expressedAs: 'acid',
    limits: [{ scope: 'all', maxPercent: 0.6, wording: '0,6 % (acid)' }],
    ukStatus: 'CALC',
    ukNote: UK_RETAINED_INFERRED,
  },
  // Entry 12 sets 0,4 % per single ester and 0,8 % for mixtures: one row per ester (and one for the acid
  // and its salts) so each is held to 0,4 % and the group to 0,8 %.
  {
    id: 'eu-annex-v-12-4-hydroxybenzoic-acid',
    list: 'EU Annex V',
    entryRef: '12',
    name: '4-Hydroxybenzoic acid and its salts (entry 12)',
    source: `${ANNEX_V}, entry 12`,
    status: 'C',
    forms: [
      { inci: '4-Hydroxybenzoic Acid', cas: '99-96-7', asFactor: 1 },
      {
        inci: 'Sodium Paraben',
        cas: '114-63-6',
        asFactor: 0.8627,
        formula: 'C7H5NaO3',
        asFormula: 'C7H6O3',
      },
      {
        inci: 'Potassium Paraben',
        cas: '16782-08-4',
        asFactor: 0.7838,
        formula: 'C7H5KO3',
        asFormula: 'C7H6O3',
      },
      {
        inci: 'Calcium Paraben',
        cas: '69959-44-0',
        asFactor: 0.8789,
        formula: 'C14H10CaO6',
        asFormula: '(C7H6O3)2',
      },
    ],
    expressedAs: 'acid',
    limits: [{ scope: 'all', maxPercent: 0.4, wording: '0,4 % (as acid) for single ester' }],
    group: PARABEN_GROUP,
    groupLimit: PARABEN_GROUP_LIMIT,
    amendedBy: 'Regulation (EU) No 1004/2014',
    placingFrom: '2015-04-16',
    availableFrom: '2015-10-16',
    note: 'Maxima read in the CosIng Annex V export and the ECHA listing. The CosIng export prints the potassium methylparaben CAS as "26112-0-2"; 26112-07-2 is the check-digit-valid form. Dates of 1004/2014 (16 Apr / 16 Oct 2015) are C2 (a copy of its Art. 2).',
    ukStatus: 'C2',
    ukNote:
      'legislation.gov.uk carries Regulation (EU) No 1004/2014 (entry 12 replaced), adopted before IP completion day; GB entry text not read.',
  },
  {
    id: 'eu-annex-v-12-methylparaben',
    list: 'EU Annex V',
    entryRef: '12',
    name: 'Methyl 4-hydroxybenzoate and its salts (entry 12)',
    source: `${ANNEX_V}, entry 12`,
    status: 'C',
    forms: [
      {
        inci: 'Methylparaben',
        cas: '99-76-3',
        asFactor: 0.9078,
        formula: 'C8H8O3',
        asFormula: 'C7H6O3',
      },
      {
        inci: 'Sodium Methylparaben',
        cas: '5026-62-0',
        asFactor: 0.7932,
        formula: 'C8H7NaO3',
        asFormula: 'C7H6O3',
      },
      {
        inci: 'Potassium Methylparaben',
        cas: '26112-07-2',
        asFactor: 0.726,
        formula: 'C8H7KO3',
        asFormula: 'C7H6O3',
      },
    ],
    expressedAs: 'acid',
    limits: [{ scope: 'all', maxPercent: 0.4, wording: '0,4 % (as acid) for single ester' }],
    group: PARABEN_GROUP,
    groupLimit: PARABEN_GROUP_LIMIT,
    amendedBy: 'Regulation (EU) No 1004/2014',
    placingFrom: '2015-04-16',
    availableFrom: '2015-10-16',
    note: 'Maxima read in the CosIng Annex V export and the ECHA listing. The CosIng export prints the potassium methylparaben CAS as "26112-0-2"; 26112-07-2 is the check-digit-valid form. Dates of 1004/2014 (16 Apr / 16 Oct 2015) are C2 (a copy of its Art. 2).',
    ukStatus: 'C2',
    ukNote:
      'legislation.gov.uk carries Regulation (EU) No 1004/2014 (entry 12 replaced), adopted before IP completion day; GB entry text not read.',
  },
  {
    id: 'eu-annex-v-12-ethylparaben',
    list: 'EU Annex V',
    entryRef: '12',
    name: 'Ethyl 4-hydroxybenzoate and its salts (entry 12)',
    source: `${ANNEX_V}, entry 12`,
    status: 'C',
    forms: [
      {
        inci: 'Ethylparaben',
        cas: '120-47-8',
        asFactor: 0.8312,
        formula: 'C9H10O3',
        asFormula: 'C7H6O3',
      },
      {
        inci: 'Sodium Ethylparaben',
        cas: '35285-68-8',
        asFactor: 0.7341,
        formula: 'C9H9NaO3',
        asFormula: 'C7H6O3',
      },
      {
        inci: 'Potassium Ethylparaben',
        cas: '36457-19-9',
        asFactor: 0.6762,
        formula: 'C9H9KO3',
        asFormula: 'C7H6O3',
      },
    ],
    expressedAs: 'acid',
    limits: [{ scope: 'all', maxPercent: 0.4, wording: '0,4 % (as acid) for single ester' }],
    group: PARABEN_GROUP,
    groupLimit: PARABEN_GROUP_LIMIT,
    amendedBy: 'Regulation (EU) No 1004/2014',
    placingFrom: '2015-04-16',
    availableFrom: '2015-10-16',
    note: 'Maxima read in the CosIng Annex V export and the ECHA listing. The CosIng export prints the potassium methylparaben CAS as "26112-0-2"; 26112-07-2 is the check-digit-valid form. Dates of 1004/2014 (16 Apr / 16 Oct 2015) are C2 (a copy of its Art. 2).',
    ukStatus: 'C2',
    ukNote:
      'legislation.gov.uk carries Regulation (EU) No 1004/2014 (entry 12 replaced), adopted before IP completion day; GB entry text not read.',
  },
  {
    id: 'eu-annex-v-12a-propylparaben-butylparaben',
    list: 'EU Annex V',
    entryRef: '12a',
    name: 'Butyl 4-hydroxybenzoate and its salts; Propyl 4-hydroxybenzoate and its salts',
    source: `${ANNEX_V}, entry 12a`,
    status: 'C',
    forms: [
      {
        inci: 'Propylparaben',
        cas: '94-13-3',
        asFactor: 0.7665,
        formula: 'C10H12O3',
        asFormula: 'C7H6O3',
      },
      {
        inci: 'Butylparaben',
        cas: '94-26-8',
        asFactor: 0.7111,
        formula: 'C11H14O3',
        asFormula: 'C7H6O3',
      },
      {
        inci: 'Sodium Propylparaben',
        cas: '35285-69-9',
        asFactor: 0.6831,
        formula: 'C10H11NaO3',
        asFormula: 'C7H6O3',
      },
      {
        inci: 'Sodium Butylparaben',
        cas: '36457-20-2',
        asFactor: 0.6388,
        formula: 'C11H13NaO3',
        asFormula: 'C7H6O3',
      },
      {
        inci: 'Potassium Propylparaben',
        cas: '84930-16-5',
        asFactor: 0.6327,
        formula: 'C10H11KO3',
        asFormula: 'C7H6O3',
      },
      {
        inci: 'Potassium Butylparaben',
        cas: '38566-94-8',
        asFactor: 0.5945,
        formula: 'C11H13KO3',
        asFormula: 'C7H6O3',
      },
    ],
    expressedAs: 'acid',
    // The 0,14 % is for the sum of this entry's forms (propyl + butyl and their salts), not per form.
    limits: [
      {
        scope: 'all',
        maxPercent: 0.14,
        wording: '0,14 % (as acid) for the sum of the individual concentrations',
      },
    ],
    group: PARABEN_GROUP,
    groupLimit: PARABEN_GROUP_LIMIT,
    conditions: [
      'Not to be used in leave-on products designed for application on the nappy area of children under three years of age',
      'Label warning applies to leave-on products designed for children under three years of age',
    ],
    labelWarning: 'Do not use on the nappy area',
    labelWarningFor: 'leave-on products designed for children under three years of age',
    amendedBy: 'Regulation (EU) No 1004/2014',
    placingFrom: '2015-04-16',
    availableFrom: '2015-10-16',
    note: 'The CosIng export numbers this entry "12 bis"; the regulation calls it 12a. Isopropyl-, isobutyl-, phenyl-, benzyl- and pentylparaben are excluded from entry 12 (they are in Annex II; that Annex II entry was not read). Dates of 1004/2014 are C2.',
    ukStatus: 'C2',
    ukNote:
      'legislation.gov.uk carries Regulation (EU) No 1004/2014, adopted before IP completion day; GB entry text not read.',
  },
  {
    id: 'eu-annex-v-13-dehydroacetic-acid',
    list: 'EU Annex V',
    entryRef: '13',
    name: '3-Acetyl-6-methylpyran-2,4(3H)-dione and its salts',
    source: `${ANNEX_V}, entry 13`,
    status: 'C',
    forms: [
      { inci: 'Dehydroacetic Acid', cas: '520-45-6', asFactor: 1 },
      {
        inci: 'Sodium Dehydroacetate',
        cas: '4418-26-2',
        asFactor: 0.8844,
        formula: 'C8H7NaO4',
        asFormula: 'C8H8O4',
      },
    ],
    expressedAs: 'acid',
    limits: [{ scope: 'all', maxPercent: 0.6, wording: '0,6 % (as acid)' }],
    conditions: ['Not to be used in aerosol dispensers (sprays)'],
    note: 'The export also lists CAS 16807-48-0 for the salt (not keyed). The factor is for the anhydrous sodium salt; a supplier selling the monohydrate needs a lower factor.',
    ukStatus: 'CALC',
    ukNote: UK_RETAINED_INFERRED,
  },
  {
    id: 'eu-annex-v-29-phenoxyethanol',
    list: 'EU Annex V',
    entryRef: '29',
    name: '2-Phenoxyethanol',
    source: `${ANNEX_V}, entry 29`,
    status: 'C',
    forms: [{ inci: 'Phenoxyethanol', cas: '122-99-6' }],
    limits: [{ scope: 'all', maxPercent: 1, wording: '1,0 %' }],
    note: 'Ethylhexylglycerin and caprylyl glycol, often blended with it, are not Annex V preservatives and have no row here.',
    ukStatus: 'CALC',
    ukNote: UK_RETAINED_INFERRED,
  },
  {
    id: 'eu-annex-v-34-benzyl-alcohol',
    list: 'EU Annex V',
    entryRef: '34',
    name: 'Benzyl alcohol',
    source: `${ANNEX_V}, entry 34`,
    status: 'C',
    forms: [{ inci: 'Benzyl Alcohol', cas: '100-51-6' }],
    limits: [{ scope: 'all', maxPercent: 1, wording: '1,0 %' }],
    amendedBy: 'Regulation (EU) No 344/2013',
    note: 'Also an Annex III fragrance allergen (entry 45, labelling only); that entry is handled in the allergen list.',
    ukStatus: 'CALC',
    ukNote: UK_RETAINED_INFERRED,
  },
  {
    id: 'eu-annex-v-39-methylchloroisothiazolinone-methylisothiazolinone',
    list: 'EU Annex V',
    entryRef: '39',
    name: 'Mixture of 5-Chloro-2-methyl-isothiazol-3(2H)-one and 2-methylisothiazol-3(2H)-one',
    source: `${ANNEX_V}, entry 39`,
    status: 'C',
    forms: [
      { inci: 'Methylchloroisothiazolinone (and) Methylisothiazolinone', cas: '55965-84-9' },
      { inci: 'Methylchloroisothiazolinone', cas: '26172-55-4' },
    ],
    expressedAs:
      'mixture in the ratio 3:1 of 5-chloro-2-methylisothiazol-3(2H)-one and 2-methylisothiazol-3(2H)-one',
    notAllowedIn: 'leave-on',
    limits: [
      {
        scope: 'rinse-off',
        maxPercent: 0.0015,
        wording:
          'Rinse-off products: 0,0015 % (of a mixture in the ratio 3:1 of 5-chloro-2-methylisothiazol-3(2H)-one and 2-methylisothiazol-3(2H)-one)',
      },
    ],
    conditions: [
      'Mutually exclusive with entry 57: the use of the mixture of Methylchloroisothiazolinone (and) Methylisothiazolinone is incompatible with the use of Methylisothiazolinone alone in the same product',
    ],
    amendedBy: 'Regulation (EU) No 1003/2014',
    placingFrom: '2015-07-16',
    availableFrom: '2016-04-16',
    note: 'Entry text and exclusivity footnote read in the GB copy of Regulation (EU) No 1003/2014 (legislation.gov.uk). The 1003/2014 dates are C2 (trade news).',
    ukStatus: 'C',
    ukNote:
      'legislation.gov.uk carries Regulation (EU) No 1003/2014, Annex, as at 31 Dec 2020, with the same entry 39.',
  },
  {
    id: 'eu-annex-v-57-methylisothiazolinone',
    list: 'EU Annex V',
    entryRef: '57',
    name: '2-Methyl-2H-isothiazol-3-one',
    source: `${ANNEX_V}, entry 57`,
    status: 'C',
    forms: [{ inci: 'Methylisothiazolinone', cas: '2682-20-4' }],
    notAllowedIn: 'leave-on',
    limits: [{ scope: 'rinse-off', maxPercent: 0.0015, wording: 'Rinse-off products: 0,0015 %' }],
    conditions: [
      'Mutually exclusive with entry 39: Methylisothiazolinone alone must not be used in the same product as the mixture Methylchloroisothiazolinone (and) Methylisothiazolinone',
    ],
    amendedBy: 'Regulation (EU) 2017/1224',
    placingFrom: '2018-01-27',
    availableFrom: '2018-04-27',
    note: 'Leave-on use was removed by Regulation (EU) 2016/1198, applying to placing and making available alike from 12 Feb 2017 (its Art. 2, read). The 0,0015 % rinse-off maximum (down from 0,01 %) is Regulation (EU) 2017/1224; its dates 27 Jan 2018 (placing) / 27 Apr 2018 (making available) are C2. The review note that 2016/1198 set 0,0015 % is wrong: 2016/1198 removed leave-on use, 2017/1224 set 0,0015 %.',
    ukStatus: 'C',
    ukNote:
      'legislation.gov.uk carries Regulations (EU) 2016/1198 and 2017/1224, both adopted before IP completion day.',
  },
  {
    id: 'eu-annex-v-46-diazolidinyl-urea',
    list: 'EU Annex V',
    entryRef: '46',
    name: "N-(Hydroxymethyl)-N-(dihydroxymethyl-1,3-dioxo-2,5-imidazolidinyl-4)-N'-(hydroxymethyl)urea",
    source: `${ANNEX_V}, entry 46`,
    status: 'C',
    forms: [{ inci: 'Diazolidinyl Urea', cas: '78491-02-8' }],
    limits: [{ scope: 'all', maxPercent: 0.5, wording: '0,5 %' }],
    conditions: [
      "Formaldehyde releaser: products shall be labelled 'releases formaldehyde' where the total formaldehyde released exceeds 0,001 % (10 ppm) (Annex V preamble as amended by Regulation (EU) 2022/1531; products complying with the rules of 30 July 2022 may be placed until 31 July 2024 and made available until 31 July 2026)",
    ],
    note: 'Sold to makers in ready blends with iodopropynyl butylcarbamate (entry 56). Maximum read in a 2015-era CosIng export; the release-labelling rule in the ECHA listing.',
    ukStatus: 'M', // from memory
    ukNote:
      'The 0,5 % entry predates IP completion day (inferred retained). The 2022/1531 "releases formaldehyde" rule is post-exit EU law; GB adoption not checked.',
  },
  {
    id: 'eu-annex-v-56-iodopropynyl-butylcarbamate',
    list: 'EU Annex V',
    entryRef: '56',
    name: '3-Iodo-2-propynylbutylcarbamate',
    source: `${ANNEX_V}, entry 56`,
    status: 'C',
    forms: [{ inci: 'Iodopropynyl Butylcarbamate', cas: '55406-53-6' }],
    limits: [
      { scope: 'rinse-off', maxPercent: 0.02, wording: '(a) Rinse-off products: 0,02 %' },
      { scope: 'leave-on', maxPercent: 0.01, wording: '(b) Leave-on products: 0,01 %' },
    ],
    conditions: [
      '(c) Deodorants/antiperspirants: 0,0075 %',
      'Not to be used in oral and lip products',
      '(b) Leave-on: not to be used in body lotion and body cream',
      '(a) Rinse-off: not to be used in products for children under 3 years of age, except in bath products/shower gels and shampoos',
      '(b) and (c): not to be used in products for children under 3 years of age',
      'Warning applies only to products which might be used for children under 3 years of age',
    ],
    labelWarning: 'Not to be used for children under three years of age',
    labelWarningFor: 'products which might be used for children under three years of age',
    note: 'Read in a 2015-era CosIng Annex V export (entry dated 16/10/2010); later amendment not checked. The body lotion / body cream exclusion matters for lotion makers using IPBC blends.',
    ukStatus: 'CALC',
    ukNote: UK_RETAINED_INFERRED,
  },

  // ---------------------------------------------------------------- Annex III: restricted substances
  {
    id: 'eu-annex-iii-98-salicylic-acid',
    list: 'EU Annex III',
    entryRef: '98',
    name: 'Benzoic acid, 2-hydroxy- (salicylic acid), for purposes other than as a preservative',
    source: `${ANNEX_III}, entry 98`,
    status: 'C2',
    forms: [{ inci: 'Salicylic Acid', cas: '69-72-7' }],
    limits: [
      {
        scope: 'all',
        maxPercent: 2,
        wording:
          '(b) Other products except body lotion, eye shadow, mascara, eyeliner, lipstick, roll-on deodorant: 2,0 %',
      },
    ],
    conditions: [
      '(a) Rinse-off hair products: 3,0 %',
      '(c) Body lotion, eye shadow, mascara, eyeliner, lipstick, roll-on deodorant: 0,5 % (a body lotion is held to 0,5 %, not 2,0 %)',
      'Not to be used in preparations for children under 3 years of age, except for shampoos',
      'Not to be used in oral products',
      "Not to be used in applications that may lead to exposure of the end-user's lungs by inhalation",
      'For purposes other than inhibiting the development of micro-organisms in the product; this purpose has to be apparent from the presentation of the product',
    ],
    labelWarning: 'Not to be used for children under 3 years of age',
    labelWarningFor:
      'products which might be used for children under three years of age and which remain in prolonged contact with the skin',
    amendedBy: 'Regulation (EU) 2021/850',
    note: 'The body-lotion 0,5 % is kept as a condition, not a leave-on limit, because a leave-on limit would wrongly hold other leave-on products to 0,5 %. (a)/(b) and the children condition read in CosIng (pre-2021 text); (c) 0,5 % from 2021/850 is C2 (a regulatory database) and matches GB SI 2022/659. EU application date of 2021/850 not confirmed (M). The CosIng record words the warning "under three years of age".',
    ukStatus: 'C',
    ukNote:
      'GB: The Toys and Cosmetic Products (Restriction of Chemical Substances) Regulations 2022 (SI 2022/659), reg. 3(6), adds (c) 0,5 % for body lotion etc.; in force 15 Dec 2022 (reg. 1(3)). Sell-through to 15 Mar 2023 is C2.',
  },
  {
    id: 'eu-annex-iii-324-methyl-salicylate',
    list: 'EU Annex III',
    entryRef: '324',
    name: 'Methyl 2-hydroxybenzoate',
    source: `${ANNEX_III}, entry 324`,
    status: 'C2',
    forms: [{ inci: 'Methyl Salicylate', cas: '119-36-8' }],
    limits: [
      {
        scope: 'rinse-off',
        maxPercent: 0.06,
        wording:
          'Rinse-off skin products (except hand wash products) and rinse-off hair products: 0,06 %',
      },
      {
        scope: 'leave-on',
        maxPercent: 0.06,
        wording:
          'Leave-on skin products (except face makeup, spray/aerosol body lotion, spray/aerosol deodorant and hydroalcoholic-based fragrances) and leave-on hair products (except spray/aerosol products): 0,06 %',
      },
    ],
    conditions: [
      'Hand wash products: 0,6 % (a liquid hand soap may go to 0,6 %; the rinse-off limit above holds it to 0,06 %)',
      'Body lotion spray/aerosol: 0,04 %',
      'Lip products: 0,03 %',
      'Face makeup (except lip products, eye makeup and makeup remover): 0,05 %',
      'Eye makeup and makeup remover: 0,002 %',
      'Deodorant spray/aerosol: 0,003 %',
      'Leave-on hair products (spray/aerosol): 0,009 %',
      'Hydroalcoholic-based fragrances: 0,6 %',
      'Toothpaste 2,52 %; mouthwash (children 6–10 years) 0,1 %; mouthwash (above 10 years and adults) 0,6 %; mouth spray 0,65 %',
      'Not to be used in preparations for children under 6 years of age, with the exception of toothpaste',
      'Labelling in the ingredient list when above 0,001 % in leave-on and 0,01 % in rinse-off products (added by Regulation (EU) 2023/1545)',
    ],
    amendedBy: 'Regulation (EU) 2022/1531',
    placingFrom: '2022-12-17',
    availableFrom: '2022-12-17',
    note: 'Maxima by product type as quoted from the ECHA/EC Annex III export in the regulatory sources file and by two regulatory news pages; entry added by 2022/1531 (Omnibus V), applying from 17 Dec 2022 with no sell-through period (C2).',
    ukStatus: 'C',
    ukNote:
      'GB carries a different entry 324: SI 2025/413, Schedule (read). 0,02 % for products intended for children 0.5–1 year in rinse-off, hand wash, leave-on and lip products; otherwise 0,06 % rinse-off and leave-on, 0,6 % hand wash, 0,03 % lip, toothpaste 2.5 %, mouthwash 0.4 %. GB dates 30 Sep 2025 (placing) / 31 Mar 2026 (making available) are C2.',
  },
  {
    id: 'eu-annex-iii-73-isoeugenol',
    list: 'EU Annex III',
    entryRef: '73',
    name: 'Isoeugenol',
    source: `${ANNEX_III}, entry 73`,
    status: 'C2',
    forms: [
      { inci: 'Isoeugenol', cas: '97-54-1' },
      { inci: 'trans-Isoeugenol', cas: '5932-68-3' },
      { inci: 'cis-Isoeugenol', cas: '5912-86-7' },
    ],
    limits: [
      {
        scope: 'all',
        maxPercent: 0.02,
        wording: 'Cosmetic products other than oral products: 0,02 %',
      },
    ],
    conditions: ['Labelling in the ingredient list above 0,001 % (leave-on) / 0,01 % (rinse-off)'],
    note: 'Maximum and CAS numbers as quoted from the ECHA/EC Annex III export (16 May 2024) in the regulatory sources file, section 2.3; not re-read here. Eugenol (entry 71) has no numeric maximum in that export, so it has no row.',
    ukStatus: 'CALC',
    ukNote: UK_RETAINED_INFERRED,
  },
  {
    id: 'eu-annex-iii-72-hydroxycitronellal',
    list: 'EU Annex III',
    entryRef: '72',
    name: '7-Hydroxycitronellal',
    source: `${ANNEX_III}, entry 72`,
    status: 'C2',
    forms: [{ inci: 'Hydroxycitronellal', cas: '107-75-5' }],
    limits: [
      { scope: 'all', maxPercent: 1, wording: 'Cosmetic products other than oral products: 1 %' },
    ],
    conditions: ['Labelling in the ingredient list above 0,001 % (leave-on) / 0,01 % (rinse-off)'],
    note: 'Maximum as quoted from the ECHA/EC Annex III export in the regulatory sources file, section 2.3; not re-read here.',
    ukStatus: 'CALC',
    ukNote: UK_RETAINED_INFERRED,
  },
  {
    id: 'eu-annex-iii-196-verbena-absolute',
    list: 'EU Annex III',
    entryRef: '196',
    name: 'Verbena absolute (Lippia citriodora / Aloysia triphylla)',
    source: `${ANNEX_III}, entry 196`,
    status: 'C2',
    forms: [
      { inci: 'Aloysia Triphylla Extract', cas: '85116-63-8' },
      { inci: 'Verbena absolute', cas: '8024-12-2' },
    ],
    limits: [{ scope: 'all', maxPercent: 0.2, wording: 'All cosmetic products: 0,2 %' }],
    amendedBy: 'Regulation (EU) 2023/1545',
    placingFrom: '2026-08-01',
    availableFrom: '2028-08-01',
    note: 'Maximum, CAS and the 2023/1545 transition footnote (products complying with the rules of 15 Aug 2023 may be placed until 31 Jul 2026 and made available until 31 Jul 2028) as quoted from the Annex III export in the regulatory sources file. Whether the 0,2 % maximum itself predates 2023/1545 was not checked.',
    ukStatus: 'M', // from memory
    ukNote:
      'Post-exit EU amendment; GB adoption of 2023/1545 not confirmed (regulatory sources file marks GB allergens open).',
  },

  // ---------------------------------------------------------------- Annex II: prohibited substances
  {
    id: 'eu-annex-ii-butylphenyl-methylpropional',
    list: 'EU Annex II',
    name: '2-(4-tert-Butylbenzyl)propionaldehyde',
    source: `${ANNEX_II} (entry number not confirmed: 1666 or 1670), as amended by Regulation (EU) 2021/1902`,
    status: 'C2',
    forms: [{ inci: 'Butylphenyl Methylpropional', cas: '80-54-6' }],
    prohibited: true,
    amendedBy: 'Regulation (EU) 2021/1902',
    placingFrom: '2022-03-01',
    availableFrom: '2022-03-01',
    effectiveFrom: '2022-03-01',
    note: 'The prohibition and its date are C2; the Annex II entry number is not confirmed, so the row carries none: a national authority (Slovak) gives 1666 for it and 1670 for zinc pyrithione, a laboratory gives the reverse. The prohibition, CAS 80-54-6 (EC 201-289-8) and the single date 1 Mar 2022 for placing and making available are C2 (four secondary sources). Annex III entry 83 (labelling) was deleted.',
    ukStatus: 'C2',
    ukNote:
      'GB adopted the ban separately: SI 2022/659, reg. 3(3) inserts CMR entries into Annex 2 and reg. 3(4)(a) omits Annex 3 entry 83 (2-(4-tert-Butylbenzyl)propionaldehyde); those provisions in force 15 Oct 2022 (reg. 1(2)). GB Annex 2 entry number and any sell-through period not read.',
  },
  {
    id: 'eu-annex-ii-zinc-pyrithione',
    list: 'EU Annex II',
    name: 'Pyrithione zinc',
    source: `${ANNEX_II} (entry number not confirmed: 1666 or 1670), as amended by Regulation (EU) 2021/1902`,
    status: 'C2',
    forms: [{ inci: 'Zinc Pyrithione', cas: '13463-41-7' }],
    prohibited: true,
    amendedBy: 'Regulation (EU) 2021/1902',
    placingFrom: '2022-03-01',
    availableFrom: '2022-03-01',
    effectiveFrom: '2022-03-01',
    note: 'The entry number is not confirmed (see butylphenyl methylpropional), so the row carries none. Prohibition from 1 Mar 2022 (CMR 1B) is C2; Annex V entry 8 and Annex III entry 101 were deleted. Met in anti-dandruff soap and shampoo bars.',
    ukStatus: 'C',
    ukNote:
      'GB: SI 2022/659 reg. 3(5) refers to "Pyrithione zinc (Annex 2, entry 1669)" and reg. 3(7) omits Annex 5 entry 8; in force 15 Oct 2022. GB entry number 1669 differs from the EU number.',
  },
  {
    id: 'eu-annex-ii-1380-hydroxyisohexyl-3-cyclohexene-carboxaldehyde',
    list: 'EU Annex II',
    entryRef: '1380',
    name: '3 and 4-(4-Hydroxy-4-methylpentyl)cyclohex-3-ene-1-carbaldehyde (HICC)',
    source: `${ANNEX_II}, entry 1380`,
    status: 'C2',
    forms: [
      { inci: 'Hydroxyisohexyl 3-Cyclohexene Carboxaldehyde', cas: '31906-04-4' },
      { inci: 'Hydroxyisohexyl 3-Cyclohexene Carboxaldehyde', cas: '51414-25-6' },
    ],
    prohibited: true,
    amendedBy: 'Regulation (EU) 2017/1410',
    placingFrom: '2019-08-23',
    availableFrom: '2021-08-23',
    note: 'Entry number, CAS numbers and dates (placing from 23 Aug 2019, making available from 23 Aug 2021) from two testing-laboratory notes quoting 2017/1410 and a regulatory news page (C2). Annex III entry 79 (labelling) deleted.',
    ukStatus: 'M', // from memory
    ukNote:
      'Inferred, not read: 2017/1410 predates IP completion day, so GB retained the ban with the same dates.',
  },
  {
    id: 'eu-annex-ii-1381-atranol',
    list: 'EU Annex II',
    entryRef: '1381',
    name: '2,6-Dihydroxy-4-methyl-benzaldehyde (Atranol)',
    source: `${ANNEX_II}, entry 1381`,
    status: 'C2',
    forms: [{ inci: 'Atranol', cas: '526-37-4' }],
    prohibited: true,
    amendedBy: 'Regulation (EU) 2017/1410',
    placingFrom: '2019-08-23',
    availableFrom: '2021-08-23',
    note: 'Natural component of oak moss and tree moss extracts (Annex III entries 91/92), so it reaches makers through those extracts. Entry, CAS and dates C2 (as HICC).',
    ukStatus: 'M', // from memory
    ukNote: 'Inferred, not read: 2017/1410 predates IP completion day, so GB retained the ban.',
  },
  {
    id: 'eu-annex-ii-1382-chloroatranol',
    list: 'EU Annex II',
    entryRef: '1382',
    name: '3-Chloro-2,6-Dihydroxy-4-methyl-benzaldehyde (Chloroatranol)',
    source: `${ANNEX_II}, entry 1382`,
    status: 'C2',
    forms: [{ inci: 'Chloroatranol', cas: '57074-21-2' }],
    prohibited: true,
    amendedBy: 'Regulation (EU) 2017/1410',
    placingFrom: '2019-08-23',
    availableFrom: '2021-08-23',
    note: 'As atranol. CAS also confirmed in GB SI 2022/659 (toys part).',
    ukStatus: 'M', // from memory
    ukNote: 'Inferred, not read: 2017/1410 predates IP completion day, so GB retained the ban.',
  },
];
