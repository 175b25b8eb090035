import {
  batchReadyOn,
  checkUnitWeights,
  checkWeighing,
  gramsPerLotUnit,
  roundTo,
  type Batch,
  type BatchAmendmentRecord,
  type BatchLine,
  type LotPickRecord,
  type LotUnit,
  type ProductProfile,
} from '@batchproof/shared';
import type { batches, BatchSheet } from '../db/schema';

/** A stored batch row. */
export type BatchRow = typeof batches.$inferSelect;

/** What a lot pick shows of its lot. */
export interface PickedLot {
  id: string;
  materialId: string;
  supplierLotNumber: string;
  expiresOn: string | null;
  unit: LotUnit;
}

/** What a batch's view reads beside its row. */
export interface BatchViewSources {
  formulaName: string;
  netQuantity: ProductProfile['netQuantity'];
  /** The lots its record picks, by id. */
  lots: ReadonlyMap<string, PickedLot>;
  /** Grams per millilitre of the materials used, by id (null when unknown). */
  gramsPerMillilitre: ReadonlyMap<string, number | null>;
  releasedByName: string | null;
  amendments: BatchAmendmentRecord[];
}

type SheetLine = BatchSheet['lines'][number];

/** The material a line is made with: its own, or the approved substitute recorded. */
export function usedMaterialOf(line: SheetLine, usedMaterialId: string | null) {
  const id = usedMaterialId ?? line.materialId;
  const name =
    id === line.materialId
      ? line.materialName
      : (line.substitutes.find((s) => s.materialId === id)?.materialName ?? line.materialName);
  return { id, name };
}

/** Grams of a pick in its lot's unit (4 decimals, as stored), or null when it cannot be converted. */
export function pickQuantity(grams: number, unit: LotUnit, gramsPerMillilitre: number | null) {
  const factor = gramsPerLotUnit(unit, gramsPerMillilitre);
  return typeof factor === 'number' ? roundTo(grams / factor, 4) : null;
}

function lotPick(
  pick: { lotId: string; grams: number },
  sources: BatchViewSources,
  materialId: string,
): LotPickRecord {
  const lot = sources.lots.get(pick.lotId);
  if (!lot)
    return {
      lotId: pick.lotId,
      supplierLotNumber: 'a lot since removed',
      expiresOn: null,
      grams: pick.grams,
      quantity: pick.grams,
      unit: 'g',
    };
  const quantity = pickQuantity(
    pick.grams,
    lot.unit,
    sources.gramsPerMillilitre.get(materialId) ?? null,
  );
  return {
    lotId: lot.id,
    supplierLotNumber: lot.supplierLotNumber,
    expiresOn: lot.expiresOn,
    grams: pick.grams,
    quantity: quantity ?? 0,
    unit: lot.unit,
  };
}

/** The lines of a batch: the weigh sheet with what was recorded and each weight's check. */
function batchLines(row: BatchRow, sources: BatchViewSources): BatchLine[] {
  const recorded = new Map(row.record.lines.map((l) => [l.lineNumber, l]));
  const lines = row.sheet.lines.map((line) => {
    const entry = recorded.get(line.lineNumber);
    const used = usedMaterialOf(line, entry?.usedMaterialId ?? null);
    return {
      line,
      used,
      lotPicks: (entry?.lotPicks ?? []).map((p) => lotPick(p, sources, used.id)),
      actualGrams: entry?.actualGrams ?? null,
    };
  });
  const checks = checkWeighing(
    lines.map((l) => ({
      name: l.used.name,
      targetGrams: l.line.grams,
      actualGrams: l.actualGrams,
    })),
    row.tolerancePercent,
  );
  return lines.map((l, i) => ({
    ...l.line,
    usedMaterialId: l.used.id,
    usedMaterialName: l.used.name,
    lotPicks: l.lotPicks,
    actualGrams: l.actualGrams,
    weighing: checks[i]!,
  }));
}

function unitWeight(row: BatchRow, netQuantity: ProductProfile['netQuantity']) {
  const weights = row.record.checks.unitWeightsGrams;
  if (weights.length === 0 || !netQuantity || netQuantity.unit !== 'g') return null;
  const { status, averageGrams, messages } = checkUnitWeights(weights, netQuantity.amount);
  return { status, averageGrams, messages };
}

const iso = (d: Date | null) => (d ? d.toISOString() : null);

/** A stored batch as the API returns it (`batchSchema`): the record as kept, with its checks. */
export function batchView(row: BatchRow, sources: BatchViewSources): Batch {
  const { record } = row;
  return {
    id: row.id,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    formulaId: row.formulaId,
    formulaName: sources.formulaName,
    version: row.versionNumber,
    batchCode: row.batchCode,
    state: row.state,
    madeOn: row.madeOn,
    size: {
      units: row.units,
      unitMassGrams: row.unitMassGrams,
      targetGrams: row.targetGrams,
      lossPercent: row.lossPercent,
      batchGrams: row.batchGrams,
    },
    sum: row.sheet.sum,
    weighSheetNotes: row.sheet.notes,
    tolerancePercent: row.tolerancePercent,
    lines: batchLines(row, sources),
    conditions: record.conditions,
    mould: record.mould,
    timing: {
      hoursInMould: record.timing.hoursInMould,
      curingDays: record.timing.curingDays,
      readyOn: batchReadyOn(row.madeOn, record.timing.hoursInMould, record.timing.curingDays),
    },
    checks: {
      appearance: record.checks.appearance,
      hardness: record.checks.hardness,
      fizzOrLather: record.checks.fizzOrLather,
      unitWeightsGrams: record.checks.unitWeightsGrams,
      unitWeight: unitWeight(row, sources.netQuantity),
      ph: record.checks.ph,
    },
    notes: record.notes,
    durability: {
      bestBeforeMonth: row.bestBeforeMonth,
      expiresOn: row.expiresOn,
      periodAfterOpeningMonths: row.periodAfterOpeningMonths,
    },
    releasedAt: iso(row.releasedAt),
    releasedBy: sources.releasedByName,
    amendments: sources.amendments,
  };
}
