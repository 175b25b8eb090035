import type { Lot, LotUnit } from '../lots/lot-schema';
import { gramsText, roundTo } from './batch-size';

/**
 * Which supplier lots to weigh each line from: first expiry first out (common practice, no
 * published source), so older stock is used before it expires. Lots are counted in g, kg, mL, L
 * or units (`LOT_UNITS`); grams come from mL only through the material's weight per millilitre,
 * and never from units.
 */

/** What a pick needs to know of a lot: the lot record as the API returns it is enough. */
export type PickableLot = Pick<
  Lot,
  'id' | 'materialId' | 'supplierLotNumber' | 'unit' | 'receivedOn' | 'expiresOn' | 'stockOnHand'
>;

/** One line to pick for. */
export interface PickLine {
  readonly materialId: string;
  /** Grams to weigh. */
  readonly grams: number;
  /**
   * The material's grams per millilitre (its `weightPerVolume.millilitre`), or null when unknown:
   * lots counted in mL or L are then not offered.
   */
  readonly gramsPerMillilitre: number | null;
}

/** Grams taken from one lot, and the same amount in the lot's own unit (to 4 decimals, as stored). */
export interface LotPick {
  readonly lotId: string;
  readonly supplierLotNumber: string;
  readonly expiresOn: string | null;
  readonly grams: number;
  readonly quantity: number;
  readonly unit: LotUnit;
}

/**
 * - `single`: the first-expiring lot that holds enough on its own.
 * - `split`: no lot holds enough on its own; the lots in expiry order together do.
 * - `short`: all usable lots together hold too little; `picks` takes all of them.
 * - `none`: no lot can be used (none in stock, all expired, or none in a unit that weighs in grams).
 */
export type LotPickStatus = 'single' | 'split' | 'short' | 'none';

/** The suggestion for one line. */
export interface LineLotPicks {
  readonly status: LotPickStatus;
  readonly picks: LotPick[];
  /** Grams still missing after the picks (0 unless `short` or `none`). */
  readonly shortGrams: number;
  /** When no single lot had enough: the split across lots in expiry order, for the maker to accept. */
  readonly split: LotPick[] | null;
  /** Plain sentences for the weigh sheet. */
  readonly notes: string[];
}

/** Grams in one of the lot's units, or a reason why the lot cannot be weighed out in grams. */
export function gramsPerLotUnit(
  unit: LotUnit,
  gramsPerMillilitre: number | null,
): number | { reason: string } {
  switch (unit) {
    case 'g':
      return 1;
    case 'kg':
      return 1000;
    case 'mL':
    case 'L': {
      if (gramsPerMillilitre === null || !(gramsPerMillilitre > 0))
        return {
          reason: `it is counted in ${unit} and the material has no weight per millilitre: enter one on the material, or choose the lot by hand`,
        };
      return (unit === 'L' ? 1000 : 1) * gramsPerMillilitre;
    }
    case 'units':
      return { reason: 'it is counted in units, which cannot be weighed out in grams' };
  }
}

/**
 * Expiry order: dated lots by expiry, lots without an expiry after every dated one, then by the
 * day received, then by supplier lot number and id so the order never depends on the input's.
 */
export function compareForPicking(a: PickableLot, b: PickableLot): number {
  if (a.expiresOn !== b.expiresOn) {
    if (a.expiresOn === null) return 1;
    if (b.expiresOn === null) return -1;
    return a.expiresOn < b.expiresOn ? -1 : 1;
  }
  if (a.receivedOn !== b.receivedOn) return a.receivedOn < b.receivedOn ? -1 : 1;
  if (a.supplierLotNumber !== b.supplierLotNumber)
    return a.supplierLotNumber < b.supplierLotNumber ? -1 : 1;
  return a.id < b.id ? -1 : a.id > b.id ? 1 : 0;
}

interface Usable {
  readonly lot: PickableLot;
  readonly factor: number;
}

function pick(usable: Usable, grams: number): LotPick {
  const { lot, factor } = usable;
  return {
    lotId: lot.id,
    supplierLotNumber: lot.supplierLotNumber,
    expiresOn: lot.expiresOn,
    grams: roundTo(grams, 6),
    quantity: roundTo(grams / factor, 4),
    unit: lot.unit,
  };
}

/** Splits `grams` across lots in expiry order; returns the picks and what is still missing. */
function splitAcross(
  usable: readonly Usable[],
  remaining: ReadonlyMap<string, number>,
  grams: number,
): { picks: LotPick[]; shortGrams: number } {
  const picks: LotPick[] = [];
  let left = grams;
  for (const u of usable) {
    if (left <= 0) break;
    const take = Math.min(left, remaining.get(u.lot.id)!);
    picks.push(pick(u, take));
    left = roundTo(left - take, 6);
  }
  return { picks, shortGrams: Math.max(0, left) };
}

function usableLots(
  line: PickLine,
  lots: readonly PickableLot[],
  madeOn: string,
  notes: string[],
): Usable[] {
  const usable: Usable[] = [];
  for (const lot of [...lots].sort(compareForPicking)) {
    if (lot.materialId !== line.materialId || lot.stockOnHand <= 0) continue;
    if (lot.expiresOn !== null && lot.expiresOn < madeOn) {
      notes.push(`Lot ${lot.supplierLotNumber} expired on ${lot.expiresOn} and is not offered`);
      continue;
    }
    const factor = gramsPerLotUnit(lot.unit, line.gramsPerMillilitre);
    if (typeof factor !== 'number') {
      notes.push(`Lot ${lot.supplierLotNumber} is not offered: ${factor.reason}`);
      continue;
    }
    usable.push({ lot, factor });
  }
  return usable;
}

function suggestLine(
  line: PickLine,
  lots: readonly PickableLot[],
  remaining: Map<string, number>,
  madeOn: string,
): LineLotPicks {
  const notes: string[] = [];
  if (line.grams <= 0) return { status: 'single', picks: [], shortGrams: 0, split: null, notes };
  const usable = usableLots(line, lots, madeOn, notes).filter((u) => remaining.get(u.lot.id)! > 0);
  if (usable.length === 0) {
    notes.push(`No lot in stock can supply ${gramsText(line.grams)}: record goods-in first`);
    return { status: 'none', picks: [], shortGrams: line.grams, split: null, notes };
  }
  const enough = usable.find((u) => remaining.get(u.lot.id)! >= line.grams);
  let result: LineLotPicks;
  if (enough) {
    const earlier = usable.slice(0, usable.indexOf(enough));
    for (const u of earlier)
      notes.push(
        `Lot ${u.lot.supplierLotNumber} expires earlier but holds only ${gramsText(remaining.get(u.lot.id)!)}`,
      );
    result = {
      status: 'single',
      picks: [pick(enough, line.grams)],
      shortGrams: 0,
      split: null,
      notes,
    };
  } else {
    const { picks, shortGrams } = splitAcross(usable, remaining, line.grams);
    if (shortGrams > 0)
      notes.push(
        `All lots in stock together hold ${gramsText(roundTo(line.grams - shortGrams, 6))}, ${gramsText(shortGrams)} short of ${gramsText(line.grams)}`,
      );
    else
      notes.push(
        `No single lot holds ${gramsText(line.grams)}: split across ${picks.length} lots in expiry order`,
      );
    result = { status: shortGrams > 0 ? 'short' : 'split', picks, shortGrams, split: picks, notes };
  }
  for (const p of result.picks)
    remaining.set(p.lotId, roundTo(remaining.get(p.lotId)! - p.grams, 6));
  return result;
}

/**
 * Suggests the lots for every line of a batch, in line order, on the batch's day (`madeOn`,
 * YYYY-MM-DD; lots expired before it are not offered). Stock taken by one line is not offered to
 * the next, so two lines of the same material never count the same grams twice.
 */
export function suggestLotPicks(
  lines: readonly PickLine[],
  lots: readonly PickableLot[],
  madeOn: string,
): LineLotPicks[] {
  const remaining = new Map<string, number>();
  for (const lot of lots) {
    for (const line of lines) {
      if (line.materialId !== lot.materialId || remaining.has(lot.id)) continue;
      const factor = gramsPerLotUnit(lot.unit, line.gramsPerMillilitre);
      if (typeof factor === 'number')
        remaining.set(lot.id, roundTo(Math.max(0, lot.stockOnHand) * factor, 6));
    }
  }
  return lines.map((line) => suggestLine(line, lots, remaining, madeOn));
}
