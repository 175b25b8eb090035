import type { ComplianceMarket } from '../reference-data/reference-row';
import type {
  AllergenResult,
  ColourantVerdict,
  ComplianceFinding,
} from '../compliance/evaluation-result-schema';
import type {
  AssessmentStatus,
  ExposureInput,
  PartB,
  SafetyNotes,
  SubstanceInput,
} from './assessment-api';

/**
 * The safety-assessment packet of one formula version: everything Annex I Part A of Regulation
 * (EC) No 1223/2009 asks for that Batchproof holds or the assessor entered, and Part B. Built by
 * the pure `buildSafetyPacket` (same content on screen, in the PDF and in the hash).
 */

/** The ten Part A headings and the four Part B headings of Annex I, in order. */
export const PART_A_HEADINGS = [
  'Quantitative and qualitative composition of the cosmetic product',
  'Physical/chemical characteristics and stability of the cosmetic product',
  'Microbiological quality',
  'Impurities, traces, information about the packaging material',
  'Normal and reasonably foreseeable use',
  'Exposure to the cosmetic product',
  'Exposure to the substances',
  'Toxicological profile of the substances',
  'Undesirable effects and serious undesirable effects',
  'Information on the cosmetic product',
] as const; // Regulation (EC) No 1223/2009, Annex I, Part A
export const PART_B_HEADINGS = [
  'Assessment conclusion',
  'Labelled warnings and instructions of use',
  'Reasoning',
  "Assessor's credentials and approval of part B",
] as const; // Regulation (EC) No 1223/2009, Annex I, Part B

/** One formula line in Part A item 1. */
export interface PacketCompositionLine {
  position: number;
  materialName: string;
  inci: string | null;
  cas: string | null;
  ec: string | null;
  /** The material's function in the product (its category in plain words). */
  function: string;
  percent: number;
  /** For fragrances: who supplies it and the certificate on file (Annex I Part A item 1). */
  fragrance: {
    supplierName: string | null;
    /** The fragrance's code as the supplier names it (the material's supplier code). */
    code: string | null;
    certificate: { title: string; issuedOn: string | null } | null;
  } | null;
}

/**
 * One substance of the product for items 7–8: a line's INCI, or a component of a blend or a
 * fragrance constituent the supplier declared, with its concentration in the finished product.
 */
export interface PacketSubstance {
  /** Stable key across saves: the lower-cased INCI (or CAS when there is no INCI). */
  key: string;
  inci: string;
  cas: string | null;
  /** C: concentration in the finished product, percent. */
  percent: number;
  /** Materials it comes from. */
  from: string[];
}

/** One substance's margin of safety (items 7–8), from `marginOfSafety`. */
export interface PacketMargin {
  substanceKey: string;
  inci: string;
  percent: number;
  dermalAbsorptionPercent: number;
  /** True when the absorption was left at the default 100 %. */
  absorptionDefaulted: boolean;
  dermalAbsorptionSource: string;
  pointOfDepartureMgPerKgDay: number | null;
  pointOfDepartureSource: string;
  /** SED, mg/kg bw/day; null when there is no exposure yet. */
  sedMgPerKgDay: number | null;
  /** MoS; null until exposure and point of departure are both there. */
  marginOfSafety: number | null;
  /** MoS under 100. */
  flagged: boolean;
}

/** Item 6 as used: the exposure input and the A it gives. */
export interface PacketExposure {
  input: ExposureInput;
  /** A: mg/kg bw/day (the preset's published value, or amount × RF × 1000 / bw). */
  exposureMgPerKgDay: number;
  /** Label of the preset, or null for the assessor's own values. */
  presetLabel: string | null;
  /** Source of the preset's values or the assessor's. */
  source: string;
  /** True when a preset was taken as shipped rather than entered by the assessor. */
  defaulted: boolean;
}

/** A complaint for item 9. */
export interface PacketUndesirableEffect {
  receivedOn: string;
  whatHappened: string;
  bodyArea: string | null;
  serious: boolean;
  batchCode: string | null;
  status: string;
}

/** Item 10 per market. */
export interface PacketMarketInformation {
  market: ComplianceMarket;
  /** The ingredient declaration as the label prints it. */
  declaration: string;
  warnings: string[];
  colourants: ColourantVerdict[];
  allergens: AllergenResult[];
}

export interface PacketDocument {
  materialName: string;
  kind: string;
  title: string;
  issuedOn: string | null;
  expiresOn: string | null;
}

export interface PacketMissingDocument {
  materialName: string;
  /** What is missing, in plain words (e.g. "Safety data sheet"). */
  what: string;
}

export interface PacketBatch {
  code: string;
  madeOn: string;
  unitsMade: number | null;
  status: string;
}

/**
 * What the formula's label identity says (item 10, and the directions for item 5), when the maker
 * entered one; names and addresses joined into one line each.
 */
export interface PacketLabelIdentity {
  productName: string;
  directions: string | null;
  shelfLifeMonths: number | null;
  periodAfterOpeningMonths: number | null;
  euResponsiblePerson: string | null;
  ukResponsiblePerson: string | null;
  usAdverseEventContact: string | null;
}

/** Everything the packet shows. `generatedAt` is the only field the hash leaves out. */
export interface SafetyPacket {
  formula: { id: string; name: string; productType: string };
  version: { id: string; number: number; state: string; releasedAt: string | null };
  workshop: { name: string; address: string | null };
  composition: PacketCompositionLine[];
  totalGrams: number;
  notes: SafetyNotes;
  exposure: PacketExposure | null;
  substances: PacketSubstance[];
  margins: PacketMargin[];
  /** Margins under 100, points of departure not entered, values left at a default: in words. */
  attention: string[];
  undesirableEffects: PacketUndesirableEffect[];
  markets: PacketMarketInformation[];
  /** The label identity of the formula; null when none is entered (absent in older packets). */
  identity?: PacketLabelIdentity | null;
  findings: ComplianceFinding[];
  documentsOnFile: PacketDocument[];
  documentsMissing: PacketMissingDocument[];
  batches: PacketBatch[];
  partB: PartB;
  assessment: {
    id: string;
    status: AssessmentStatus;
    assessorName: string;
    signedAt: string | null;
    signedByName: string | null;
    contentHash: string | null;
  };
  generatedAt: string;
}

/** `GET /api/assessments/:id`: the assessment, its packet and the hash of its content now. */
export interface AssessmentDetail {
  id: string;
  status: AssessmentStatus;
  formulaId: string;
  versionId: string;
  versionNumber: number;
  /** The stored inputs (what the assessor typed), as `PUT` takes them. */
  exposure: ExposureInput | null;
  substances: SubstanceInput[];
  partB: PartB;
  packet: SafetyPacket;
  /** SHA-256 of the packet content as it is now (what signing must quote). */
  contentHash: string;
  /** Whether the caller may edit and sign (the assessor of a draft). */
  canEdit: boolean;
}
