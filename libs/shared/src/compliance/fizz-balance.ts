import type { ReferenceStatus } from '../reference-data/reference-row';
import { normaliseName } from './ingredient-names';
import { molarMass } from './molar-mass';

/** An acid or base of an effervescent (fizzing) product. */
export interface FizzReactant {
  readonly id:
    'sodium-bicarbonate' | 'citric-acid' | 'citric-acid-monohydrate' | 'potassium-bitartrate';
  readonly name: string;
  readonly formula: string;
  readonly role: 'base' | 'acid';
  /** Moles of NaHCO3 one mole neutralises (acids) or 1 (the base). */
  readonly equivalents: number;
  readonly molarMass: number;
  readonly source: string;
  readonly status: ReferenceStatus;
}

/** Reactants Batchproof balances; citric acid from 3 NaHCO3 + C6H8O7 → Na3C6H5O7 + 3 H2O + 3 CO2. */
export const fizzReactants: readonly FizzReactant[] = [
  {
    id: 'sodium-bicarbonate',
    name: 'Sodium Bicarbonate',
    formula: 'NaHCO3',
    role: 'base',
    equivalents: 1,
    molarMass: molarMass('NaHCO3'),
    source: 'Reaction 3 NaHCO3 + C6H8O7 → Na3C6H5O7 + 3 H2O + 3 CO2 (chemistry references)',
    status: 'C2',
  },
  {
    id: 'citric-acid',
    name: 'Citric Acid (anhydrous)',
    formula: 'C6H8O7',
    role: 'acid',
    equivalents: 3,
    molarMass: molarMass('C6H8O7'),
    source: 'Reaction 3 NaHCO3 + C6H8O7 → Na3C6H5O7 + 3 H2O + 3 CO2 (chemistry references)',
    status: 'C2',
  },
  {
    id: 'citric-acid-monohydrate',
    name: 'Citric Acid Monohydrate',
    formula: 'C6H8O7(H2O)',
    role: 'acid',
    equivalents: 3,
    molarMass: molarMass('C6H8O7(H2O)'),
    source: 'As citric acid; the water of crystallisation adds mass only',
    status: 'C2',
  },
  // from memory: cream of tartar gives up one proton, KHC4H4O6 + NaHCO3 → KNaC4H4O6 + H2O + CO2.
  {
    id: 'potassium-bitartrate',
    name: 'Potassium Bitartrate (cream of tartar)',
    formula: 'KC4H5O6',
    role: 'acid',
    equivalents: 1,
    molarMass: molarMass('KC4H5O6'),
    source: 'Monoprotic acid salt (from memory)',
    status: 'M',
  },
];

const CO2_MOLAR_MASS = molarMass('CO2');

/** A formula line for {@link fizzBalance}: name it, or say which reactant it is. */
export interface FizzLine {
  readonly inci: string;
  readonly name?: string;
  readonly grams: number;
  /** Which reactant the line is, when the INCI name alone cannot tell (citric acid anhydrous vs monohydrate). */
  readonly reactant?: FizzReactant['id'];
}

/** Result of {@link fizzBalance}. */
export interface FizzBalance {
  readonly baseGrams: number;
  readonly acidGrams: number;
  /** Which side runs out first, or `none` when a side is missing. */
  readonly limiting: 'base' | 'acid' | 'balanced' | 'none';
  /** Grams of the reactant left over once the limiting one is used up. */
  readonly excessGrams: number;
  /** CO2 released when the limiting reactant is used up, grams. */
  readonly co2Grams: number;
  /** Acid-side grams (of the acids used, in the same proportions) that would exactly match the base. */
  readonly acidGramsForBase: number;
  /** Lines counted, with the reactant each was read as. */
  readonly reactants: { line: number; reactant: FizzReactant['id']; grams: number }[];
  readonly notes: string[];
}

function identify(line: FizzLine): FizzReactant | undefined {
  if (line.reactant) return fizzReactants.find((r) => r.id === line.reactant);
  const names = `${normaliseName(line.inci)} ${normaliseName(line.name ?? '')}`;
  if (/sodium bicarbonate|baking soda/.test(names)) return fizzReactants[0];
  if (/citric acid/.test(names))
    return /monohydrate/.test(names) ? fizzReactants[2] : fizzReactants[1];
  if (/potassium bitartrate|potassium acid tartrate|cream of tartar/.test(names))
    return fizzReactants[3];
  return undefined;
}

/**
 * Acid/base balance of an effervescent product: sodium bicarbonate against citric acid (anhydrous or
 * monohydrate) and cream of tartar. Works in moles of CO2-producing equivalents, so 1 mol citric acid
 * neutralises 3 mol NaHCO3 and each reacting NaHCO3 releases 1 mol CO2.
 */
export function fizzBalance(lines: readonly FizzLine[]): FizzBalance {
  const reactants: FizzBalance['reactants'] = [];
  const notes: string[] = [];
  let baseEq = 0;
  let acidEq = 0;
  let baseGrams = 0;
  let acidGrams = 0;
  const acidParts: { reactant: FizzReactant; equivalents: number }[] = [];
  lines.forEach((line, index) => {
    const reactant = identify(line);
    if (!reactant || line.grams <= 0) return;
    reactants.push({ line: index, reactant: reactant.id, grams: line.grams });
    const equivalents = (line.grams / reactant.molarMass) * reactant.equivalents;
    if (reactant.role === 'base') {
      baseEq += equivalents;
      baseGrams += line.grams;
    } else {
      acidEq += equivalents;
      acidGrams += line.grams;
      acidParts.push({ reactant, equivalents });
      if (reactant.status === 'M')
        notes.push(`${reactant.name}: its reaction is from memory, not yet confirmed.`);
    }
    if (reactant.id === 'citric-acid' && !line.reactant) {
      notes.push('Citric acid read as anhydrous; mark monohydrate if that is what you use.');
    }
  });
  // Grams of the acid mix per equivalent, in the proportions actually used.
  const gramsPerAcidEq =
    acidEq > 0
      ? acidParts.reduce(
          (sum, p) =>
            sum + (p.equivalents / acidEq) * (p.reactant.molarMass / p.reactant.equivalents),
          0,
        )
      : molarMass('C6H8O7') / 3;
  const baseMolar = fizzReactants[0]!.molarMass;
  const reacted = Math.min(baseEq, acidEq);
  let limiting: FizzBalance['limiting'];
  let excessGrams = 0;
  if (baseEq === 0 || acidEq === 0) limiting = 'none';
  else if (Math.abs(baseEq - acidEq) <= 1e-9 * Math.max(baseEq, acidEq)) limiting = 'balanced';
  else if (acidEq < baseEq) {
    limiting = 'acid';
    excessGrams = (baseEq - acidEq) * baseMolar;
  } else {
    limiting = 'base';
    excessGrams = (acidEq - baseEq) * gramsPerAcidEq;
  }
  if (limiting === 'none') notes.push('Needs both sodium bicarbonate and an acid to fizz.');
  return {
    baseGrams,
    acidGrams,
    limiting,
    excessGrams,
    co2Grams: reacted * CO2_MOLAR_MASS,
    acidGramsForBase: baseEq * gramsPerAcidEq,
    reactants,
    notes: [...new Set(notes)],
  };
}
