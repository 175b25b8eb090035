import type { ReferenceRow } from './reference-row';

/**
 * A surfactant that serves as a detergent or foaming ingredient whatever function the maker typed:
 * with one of these in a bath product, the product is a "foaming detergent bath product" (21 CFR 740.17).
 */
export interface FoamingSurfactant extends ReferenceRow {
  /** Its usual INCI name. */
  readonly name: string;
  /** INCI names it is sold under (matched case-insensitively). */
  readonly inciNames: readonly string[];
}

const COSING =
  'European Commission CosIng ingredient functions (cleansing surfactant or foaming), as makers buy these';

function surfactant(id: string, inciNames: string[], note?: string): FoamingSurfactant {
  // from memory: the CosIng function entries were not re-read for this list.
  return {
    id,
    name: inciNames[0]!,
    inciNames,
    source: COSING,
    status: 'M',
    ...(note ? { note } : {}),
  };
}

/**
 * Cleansing and foaming surfactants common in bubble bars, foaming fizzers and body washes. From
 * memory (status M): the list decides only whether the 740.17 caution is added, never blocks.
 */
export const foamingSurfactants: readonly FoamingSurfactant[] = [
  surfactant('sodium-lauryl-sulfoacetate', ['Sodium Lauryl Sulfoacetate']),
  surfactant('sodium-lauryl-sulfate', ['Sodium Lauryl Sulfate']),
  surfactant('sodium-laureth-sulfate', ['Sodium Laureth Sulfate']),
  surfactant('sodium-coco-sulfate', ['Sodium Coco-Sulfate', 'Sodium Coco Sulfate']),
  surfactant('sodium-cocoyl-isethionate', ['Sodium Cocoyl Isethionate']),
  surfactant('disodium-laureth-sulfosuccinate', ['Disodium Laureth Sulfosuccinate']),
  surfactant('disodium-lauryl-sulfosuccinate', ['Disodium Lauryl Sulfosuccinate']),
  surfactant('cocamidopropyl-betaine', ['Cocamidopropyl Betaine']),
  surfactant('coco-betaine', ['Coco-Betaine', 'Coco Betaine']),
  surfactant('decyl-glucoside', ['Decyl Glucoside']),
  surfactant('coco-glucoside', ['Coco-Glucoside', 'Coco Glucoside']),
  surfactant('lauryl-glucoside', ['Lauryl Glucoside']),
  surfactant('sodium-cocoamphoacetate', ['Sodium Cocoamphoacetate']),
  surfactant('sodium-lauroyl-sarcosinate', ['Sodium Lauroyl Sarcosinate']),
  surfactant('sodium-cocoyl-glutamate', ['Sodium Cocoyl Glutamate']),
  surfactant('sodium-lauroyl-methyl-isethionate', ['Sodium Lauroyl Methyl Isethionate']),
  surfactant('ammonium-lauryl-sulfate', ['Ammonium Lauryl Sulfate']),
  surfactant('sodium-c14-16-olefin-sulfonate', ['Sodium C14-16 Olefin Sulfonate']),
];
