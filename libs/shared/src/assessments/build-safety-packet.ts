import type { EvaluationResult } from '../compliance/evaluation-result-schema';
import type { ProductIdentity } from '../labels/product-identity';
import type { EvaluationInput } from '../compliance/evaluation-input-schema';
import { expandFormula } from '../compliance/formula-expansion';
import { MATERIAL_CATEGORY_LABELS } from '../materials/material-category-labels';
import {
  materialToEngineInput,
  type EngineMaterialSource,
} from '../materials/material-engine-input';
import { isScentCategory, type MaterialCategory } from '../materials/material-schema';
import type {
  AssessmentStatus,
  ExposureInput,
  PartB,
  SafetyNotes,
  SubstanceInput,
} from './assessment-api';
import { productExposure } from './exposure-defaults';
import { marginAttention, substanceMargins } from './substance-margins';
import type {
  PacketBatch,
  PacketCompositionLine,
  PacketDocument,
  PacketExposure,
  PacketLabelIdentity,
  PacketMarketInformation,
  PacketMissingDocument,
  PacketSubstance,
  PacketUndesirableEffect,
  SafetyPacket,
} from './safety-packet';

/** A formula line with its material as stored (the fields the engine and the packet read). */
export interface SafetyPacketLineInput {
  /** 1-based position in the formula. */
  position: number;
  grams: number;
  material: EngineMaterialSource & {
    ec: string | null;
    supplierName: string | null;
  };
  /** For a fragrance or essential oil: the IFRA certificate on file (newest in use), if any. */
  certificate: { title: string; issuedOn: string | null } | null;
}

/** Everything {@link buildSafetyPacket} lays out; the API gathers it from the database. */
export interface SafetyPacketInput {
  formula: { id: string; name: string; productType: string };
  version: { id: string; number: number; state: string; releasedAt: string | null };
  workshop: { name: string; address: string | null };
  lines: SafetyPacketLineInput[];
  /** The version's stored evaluation (declarations, warnings, colourants, allergens, findings). */
  evaluation: EvaluationResult | null;
  /** The formula's product identity (label details), or null when none is entered. */
  identity: ProductIdentity | null;
  notes: SafetyNotes;
  /** Complaints about the formula, newest first. */
  complaints: PacketUndesirableEffect[];
  documentsOnFile: PacketDocument[];
  documentsMissing: PacketMissingDocument[];
  batches: PacketBatch[];
  assessment: {
    id: string;
    status: AssessmentStatus;
    assessorName: string;
    exposure: ExposureInput | null;
    substances: SubstanceInput[];
    partB: PartB;
    signedAt: string | null;
    signedByName: string | null;
    contentHash: string | null;
  };
  /** ISO timestamp the packet is generated at (left out of the hash). */
  generatedAt: string;
}

/** The key a substance keeps across saves: lower-cased INCI, or the CAS number when no INCI. */
export function substanceKey(inci: string, cas: string | null | undefined): string {
  const name = inci.trim().toLowerCase();
  return name || (cas ?? '').trim();
}

/** The material's function in plain words: its listed functions, else its category. */
function functionWords(material: SafetyPacketLineInput['material']): string {
  if (material.functions.length > 0) return material.functions.join(', ');
  return MATERIAL_CATEGORY_LABELS[material.category as MaterialCategory] ?? material.category;
}

/**
 * The product's substances for items 7–8: each ingredient of the expanded formula (a line's INCI,
 * or a blend's components, through `expandFormula`) and each fragrance constituent the supplier
 * declared (percent of the neat oil × the line's percent), the same substance from several
 * materials merged and summed.
 */
function productSubstances(
  lines: readonly SafetyPacketLineInput[],
  engineLines: EvaluationInput['lines'],
): { substances: PacketSubstance[]; percents: number[]; totalGrams: number } {
  const expanded = expandFormula({ lines: engineLines });
  const merged = new Map<string, PacketSubstance>();
  const add = (inci: string, cas: string | null | undefined, percent: number, from: string) => {
    if (!(percent > 0)) return;
    const key = substanceKey(inci, cas);
    if (!key) return;
    const entry = merged.get(key);
    if (!entry) {
      merged.set(key, { key, inci: inci.trim(), cas: cas ?? null, percent, from: [from] });
      return;
    }
    entry.percent += percent;
    entry.cas ??= cas ?? null;
    if (!entry.from.includes(from)) entry.from.push(from);
  };
  for (const ingredient of expanded.ingredients) {
    add(ingredient.inci, ingredient.cas, ingredient.percent, ingredient.materialName);
  }
  engineLines.forEach((line, index) => {
    const linePercent = expanded.lines[index]?.percent ?? 0;
    for (const allergen of line.material.fragrance?.allergens ?? []) {
      add(
        allergen.inci,
        allergen.cas,
        (linePercent * allergen.percent) / 100,
        lines[index]!.material.tradeName,
      );
    }
  });
  const substances = [...merged.values()].sort(
    (a, b) => b.percent - a.percent || a.key.localeCompare(b.key),
  );
  return {
    substances,
    percents: expanded.lines.map((l) => l.percent),
    totalGrams: expanded.totalGrams,
  };
}

/** Exposure to the product (item 6) as used: the input and the A `productExposure` gives. */
function packetExposure(input: ExposureInput | null): PacketExposure | null {
  return input ? { input, ...productExposure(input) } : null;
}

const joined = (...parts: (string | null)[]) => parts.filter(Boolean).join(', ') || null;

/** What the label identity says, for items 5 and 10. */
function labelIdentity(identity: ProductIdentity | null): PacketLabelIdentity | null {
  if (!identity) return null;
  const { euResponsiblePerson: eu, ukResponsiblePerson: uk, usAdverseEventContact: us } = identity;
  return {
    productName: identity.productName,
    directions: identity.directions,
    shelfLifeMonths: identity.shelfLifeMonths,
    periodAfterOpeningMonths: identity.periodAfterOpeningMonths,
    euResponsiblePerson: joined(eu.name, eu.address),
    ukResponsiblePerson: joined(uk.name, uk.address),
    usAdverseEventContact: joined(us.address, us.phone, us.website),
  };
}

/** Item 10 per market, from the stored evaluation as it is. */
function marketInformation(evaluation: EvaluationResult | null): PacketMarketInformation[] {
  if (!evaluation) return [];
  return evaluation.markets.map((market) => ({
    market,
    declaration: evaluation.declarations[market]?.text ?? '',
    warnings: evaluation.warnings[market] ?? [],
    colourants: evaluation.colourants[market] ?? [],
    allergens: evaluation.allergens[market] ?? [],
  }));
}

/**
 * Lays out the packet of one formula version: composition, the maker's notes, exposure, each
 * substance's SED and margin of safety, undesirable effects, product information and Part B.
 * Pure: the same input gives the same packet on screen, in the PDF and in the hash.
 */
export function buildSafetyPacket(input: SafetyPacketInput): SafetyPacket {
  const engineLines: EvaluationInput['lines'] = input.lines.map((l) => ({
    grams: l.grams,
    material: materialToEngineInput(l.material),
  }));
  const { substances, percents, totalGrams } = productSubstances(input.lines, engineLines);
  const composition: PacketCompositionLine[] = input.lines.map((l, index) => {
    const m = l.material;
    return {
      position: l.position,
      materialName: m.tradeName,
      inci: m.inci || null,
      cas: m.cas,
      ec: m.ec,
      function: functionWords(m),
      percent: percents[index] ?? 0,
      fragrance: isScentCategory(m.category)
        ? { supplierName: m.supplierName, code: null, certificate: l.certificate }
        : null,
    };
  });
  const exposure = packetExposure(input.assessment.exposure);
  const margins = substanceMargins(
    exposure?.exposureMgPerKgDay ?? null,
    substances,
    input.assessment.substances,
  );
  const a = input.assessment;
  return {
    formula: { ...input.formula },
    version: { ...input.version },
    workshop: { ...input.workshop },
    composition,
    totalGrams,
    notes: { ...input.notes },
    exposure,
    substances,
    margins,
    attention: marginAttention(margins, exposure),
    undesirableEffects: input.complaints,
    markets: marketInformation(input.evaluation),
    identity: labelIdentity(input.identity),
    findings: input.evaluation?.findings ?? [],
    documentsOnFile: input.documentsOnFile,
    documentsMissing: input.documentsMissing,
    batches: input.batches,
    partB: { ...a.partB },
    assessment: {
      id: a.id,
      status: a.status,
      assessorName: a.assessorName,
      signedAt: a.signedAt,
      signedByName: a.signedByName,
      contentHash: a.contentHash,
    },
    generatedAt: input.generatedAt,
  };
}

/** JSON with object keys sorted at every level; `undefined` members left out as JSON does. */
function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== 'object') return JSON.stringify(value) ?? 'null';
  if (Array.isArray(value)) return `[${value.map((v) => canonicalJson(v ?? null)).join(',')}]`;
  const entries = Object.entries(value as Record<string, unknown>)
    .filter(([, v]) => v !== undefined)
    .sort(([x], [y]) => (x < y ? -1 : x > y ? 1 : 0));
  return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
}

/**
 * What the packet's SHA-256 covers: canonical JSON (keys sorted) of the packet without
 * `generatedAt` and without the signature's own fields (status, signedAt, signedByName,
 * contentHash), so signing does not change the hash it records.
 */
export function packetHashContent(packet: SafetyPacket): string {
  const { generatedAt: _generatedAt, assessment, ...rest } = packet;
  const { id, assessorName } = assessment;
  return canonicalJson({ ...rest, assessment: { id, assessorName } });
}
