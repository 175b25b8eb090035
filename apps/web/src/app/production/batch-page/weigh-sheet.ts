import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatError, MatFormField, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect, MatSelectTrigger } from '@angular/material/select';
import {
  type Batch,
  type BatchLine,
  MAX_LOTS_PER_LINE,
  type WeighingCheck,
} from '@batchproof/shared';
import { errorMessage } from '../../forms/form-errors';
import { LotChoices } from '../lot-choices';
import { type LineForm, lotPickForm } from './batch-form';

/** A lot as an option: its number, expiry and what is on hand. */
interface LotOption {
  id: string;
  label: string;
}

/**
 * The weigh sheet of a batch, one row per line: the material (or an approved substitute), the
 * grams to weigh, the suggested lots, the lots weighed from, the actual weight and its check
 * against the tolerance. Editable on a draft for those who record batches; read-only otherwise.
 */
@Component({
  selector: 'bp-weigh-sheet',
  imports: [
    DecimalPipe,
    MatButton,
    MatError,
    MatFormField,
    MatIcon,
    MatIconButton,
    MatInput,
    MatLabel,
    MatOption,
    MatSelect,
    MatSelectTrigger,
    MatSuffix,
    ReactiveFormsModule,
  ],
  templateUrl: './weigh-sheet.html',
  styleUrl: './weigh-sheet.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WeighSheet {
  readonly batch = input.required<Batch>();
  /** The lines' controls, or null when the sheet is read-only. */
  readonly lines = input<LineForm[] | null>(null);
  /** Each line's weight against its target, as typed. */
  readonly weighing = input.required<readonly WeighingCheck[]>();

  private readonly fb = inject(NonNullableFormBuilder);
  private readonly choices = inject(LotChoices);
  protected readonly errorMessage = errorMessage;
  protected readonly maxLots = MAX_LOTS_PER_LINE;

  /** Lot numbers the batch already knows (suggested or picked), by lot id. */
  private readonly knownLots = computed(() => {
    const known = new Map<string, string>();
    for (const line of this.batch().lines)
      for (const p of [...line.suggestedPicks.picks, ...line.lotPicks])
        known.set(p.lotId, lotLabel(p.supplierLotNumber, p.expiresOn));
    return known;
  });

  protected materialOptions(line: BatchLine) {
    return [{ materialId: line.materialId, materialName: line.materialName }, ...line.substitutes];
  }

  /** The chosen material's name, for the closed select (the options also say "approved substitute"). */
  protected materialName(line: BatchLine, materialId: string | null): string {
    return this.materialOptions(line).find((m) => m.materialId === materialId)?.materialName ?? '';
  }

  /** The chosen lot's number, for the closed select. */
  protected lotNumber(index: number, lotId: string | null): string {
    const label = this.lotOptions(index).find((o) => o.id === lotId)?.label ?? '';
    return label.split(' ')[0] ?? '';
  }

  /** The lots a line may be weighed from: its material's lots with stock, and any already known. */
  protected lotOptions(index: number): LotOption[] {
    const form = this.lines()?.[index];
    const line = this.batch().lines[index]!;
    const materialId = form?.controls.usedMaterialId.value ?? line.usedMaterialId;
    const options = new Map<string, string>();
    for (const lot of this.choices.lotsOf(materialId)() ?? [])
      options.set(
        lot.id,
        `${lotLabel(lot.supplierLotNumber, lot.expiresOn)} · ${lot.stockOnHand} ${lot.unit} on hand`,
      );
    for (const pick of form?.controls.lotPicks.controls ?? []) {
      const id = pick.controls.lotId.value;
      if (id && !options.has(id)) options.set(id, this.knownLots().get(id) ?? 'A lot');
    }
    return [...options].map(([id, label]) => ({ id, label }));
  }

  protected words(check: WeighingCheck): string {
    return weighingWords(check, this.batch().tolerancePercent);
  }

  /** Takes the suggested picks as the lots weighed from. */
  protected useSuggestion(index: number): void {
    const form = this.lines()?.[index];
    const line = this.batch().lines[index]!;
    if (!form) return;
    const picks = form.controls.lotPicks;
    picks.clear();
    for (const p of line.suggestedPicks.picks)
      picks.push(lotPickForm(this.fb, { lotId: p.lotId, grams: p.grams }));
    if (form.controls.actualGrams.value === null && line.suggestedPicks.shortGrams === 0)
      form.controls.actualGrams.setValue(line.weighGrams);
    form.markAsDirty();
  }

  protected addLot(index: number): void {
    const form = this.lines()?.[index];
    if (!form) return;
    this.choices.lotsOf(form.controls.usedMaterialId.value);
    form.controls.lotPicks.push(lotPickForm(this.fb, { lotId: '', grams: null }));
    form.markAsDirty();
  }

  protected removeLot(index: number, pick: number): void {
    const form = this.lines()?.[index];
    if (!form) return;
    form.controls.lotPicks.removeAt(pick);
    form.markAsDirty();
  }

  /** Reads the lots of the line's material when its list first opens. */
  protected loadLots(index: number): void {
    const form = this.lines()?.[index];
    if (form) this.choices.lotsOf(form.controls.usedMaterialId.value);
  }
}

function lotLabel(supplierLotNumber: string, expiresOn: string | null): string {
  return expiresOn ? `${supplierLotNumber} (expires ${expiresOn})` : supplierLotNumber;
}

/** The words of a weighing check, as the sheet and screen readers give them. */
export function weighingWords(check: WeighingCheck, tolerancePercent: number): string {
  switch (check.status) {
    case 'not-weighed':
      return 'Not weighed yet';
    case 'ok':
      return check.deviationPercent === null
        ? 'Within tolerance'
        : `Within ±${tolerancePercent} % (${signed(check.deviationPercent)} %)`;
    case 'out': {
      if (check.deviationPercent === null) return `Out of tolerance: ${check.message ?? ''}`;
      const d = check.deviationPercent;
      return `Out of tolerance: ${Math.abs(round2(d))} % ${d > 0 ? 'over' : 'under'} the target (allowed ±${tolerancePercent} %)`;
    }
  }
}

const round2 = (n: number) => Math.round(n * 100) / 100;
const signed = (n: number) => (n > 0 ? `+${round2(n)}` : `${round2(n)}`);
