import { usPart73ColourAdditives } from './us-colour-additives-part-73';
import { usPart74ColourAdditives } from './us-colour-additives-part-74';
import type { UsColourAdditive } from './us-colour-additive-row';
import type { ReferenceRow } from './reference-row';

export type { UsColourAdditive, UsColourAdditiveUses } from './us-colour-additive-row';

/**
 * US colour additives for cosmetics relevant to bath and body products, from the regulatory sources
 * file (sections 3.2 and 15; section 15 wins where they differ). Part 73 colours are exempt from
 * certification; Part 74 colours need FDA-certified batches (21 CFR 73.2575(d), 74.2330(d)).
 * Rows whose use paragraph is `M` warn but never block.
 */
export const usColourAdditives: readonly UsColourAdditive[] = [
  ...usPart73ColourAdditives,
  ...usPart74ColourAdditives,
];

/** A colourant makers meet that has no US listing for cosmetics. */
export interface UsNotPermittedColourant extends ReferenceRow {
  /** Its usual name. */
  readonly name: string;
  /** Other names (lower-case matching). */
  readonly aliases: readonly string[];
  /** Colour Index numbers. */
  readonly colourIndex: readonly string[];
  /** Why it is not permitted. */
  readonly reason: string;
}

/** Colourants with no US cosmetic listing (FDA/ICMAD regulatory information sheet; 21 CFR Parts 73, 74). */
export const usNotPermittedColourants: readonly UsNotPermittedColourant[] = [
  {
    id: 'us-np-fdc-red-3',
    name: 'FD&C Red No. 3',
    aliases: ['red 3', 'erythrosine'],
    colourIndex: ['45430'],
    reason: 'Listed for food (74.303) and ingested drugs (74.1303) only: no cosmetic listing.',
    source: 'FDA/ICMAD regulatory information sheet; 21 CFR 74.303, 74.1303',
    status: 'C',
  },
  {
    id: 'us-np-fdc-blue-2',
    name: 'FD&C Blue No. 2',
    aliases: ['blue 2', 'indigotine'],
    colourIndex: ['73015'],
    reason:
      'Listed for food, drugs and devices only (74.102, 74.1102, 74.3102): no cosmetic listing.',
    source: 'FDA/ICMAD regulatory information sheet',
    status: 'C',
  },
  {
    id: 'us-np-dc-blue-9',
    name: 'D&C Blue No. 9',
    aliases: ['blue 9'],
    colourIndex: ['69825'],
    reason: 'Listed for drugs or devices only: no cosmetic listing.',
    source: 'FDA/ICMAD regulatory information sheet',
    status: 'C',
    note: 'CI number from memory.',
  },
  {
    id: 'us-np-dc-blue-6',
    name: 'D&C Blue No. 6',
    aliases: ['blue 6'],
    colourIndex: ['73000'],
    reason: 'Listed for drugs or devices only: no cosmetic listing.',
    source: 'FDA/ICMAD regulatory information sheet',
    status: 'C',
    note: 'CI number from memory.',
  },
  {
    id: 'us-np-copper-phthalocyanine-blue',
    name: 'Copper Phthalocyanine Blue',
    aliases: ['pigment blue 15', 'phthalocyanine blue'],
    colourIndex: ['74160'],
    reason: 'Listed only for medical devices (74.3045): no cosmetic listing.',
    source: 'FDA/ICMAD regulatory information sheet; 21 CFR 74.3045',
    status: 'C',
  },
  {
    id: 'us-np-phthalocyanine-green',
    name: 'Phthalocyanine Green',
    aliases: ['pigment green 7'],
    colourIndex: ['74260'],
    reason: 'Not listed for cosmetics.',
    source: 'FDA/ICMAD regulatory information sheet (no cosmetic listing; CI 74260 from memory)',
    status: 'M',
  },
];
