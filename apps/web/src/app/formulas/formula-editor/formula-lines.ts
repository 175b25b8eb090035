import { DecimalPipe } from '@angular/common';
import {
  afterNextRender,
  ChangeDetectionStrategy,
  Component,
  computed,
  ElementRef,
  inject,
  Injector,
  input,
} from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatDialog } from '@angular/material/dialog';
import { MatError, MatFormField, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatTooltip } from '@angular/material/tooltip';
import { errorMessage } from '../../forms/form-errors';
import { MaterialPicker } from '../../materials/material-picker/material-picker';
import { VolumeDialog, type VolumeLine } from '../scaling/volume-dialog';
import { LineSubstitutes } from './line-substitutes';
import {
  type EntryMode,
  type FormulaForm,
  type FormulaFormValue,
  lineGrams,
  lineGroup,
  type LineSeed,
  switchEntry,
} from './formula-form';

const EMPTY_LINE: LineSeed = { materialId: '', materialName: '', grams: null, percent: null };

/**
 * The formula's lines: a material and an amount each, in grams or in percent of a batch total
 * (switching converts), and any approved substitutes. Totals and each line's share follow every
 * keystroke. Lines are added,
 * removed and moved with ordinary buttons, so all of it works from the keyboard.
 */
@Component({
  selector: 'bp-formula-lines',
  imports: [
    DecimalPipe,
    ReactiveFormsModule,
    MatButton,
    MatButtonToggle,
    MatButtonToggleGroup,
    MatError,
    MatFormField,
    MatIcon,
    MatIconButton,
    MatInput,
    MatLabel,
    MatSuffix,
    MatTooltip,
    MaterialPicker,
    LineSubstitutes,
  ],
  templateUrl: './formula-lines.html',
  styleUrl: './formula-lines.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FormulaLines {
  readonly form = input.required<FormulaForm>();
  /** The form's current value, as a signal the parent keeps. */
  readonly value = input.required<FormulaFormValue>();
  /** Whether the lines are shown but cannot change. */
  readonly readOnly = input(false);

  private readonly fb = inject(NonNullableFormBuilder);
  private readonly dialog = inject(MatDialog);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly injector = inject(Injector);
  protected readonly errorMessage = errorMessage;

  protected readonly entry = computed(() => this.value().entry);
  protected readonly lines = computed(() => this.form().controls.lines.controls);
  /** Grams and percent of each line, and the totals, from what is typed now. */
  protected readonly sums = computed(() => {
    const v = this.value();
    const grams = lineGrams(v);
    const totalGrams = grams.reduce((s, g) => s + g, 0);
    const percents =
      v.entry === 'percent'
        ? v.lines.map((l) => l.percent ?? 0)
        : grams.map((g) => (totalGrams > 0 ? (g / totalGrams) * 100 : 0));
    const totalPercent = percents.reduce((s, p) => s + p, 0);
    return { grams, percents, totalGrams, totalPercent, leftPercent: 100 - totalPercent };
  });

  protected changeEntry(mode: EntryMode): void {
    switchEntry(this.form(), mode);
    this.form().markAsDirty();
  }

  protected addLine(seed: LineSeed = EMPTY_LINE): void {
    const lines = this.form().controls.lines;
    lines.push(lineGroup(this.fb, seed));
    this.form().markAsDirty();
    this.focusMaterial(lines.length - 1);
  }

  protected removeLine(index: number): void {
    this.form().controls.lines.removeAt(index);
    this.form().markAsDirty();
    const remaining = this.form().controls.lines.length;
    if (remaining > 0) this.focusMaterial(Math.min(index, remaining - 1));
  }

  /** Moves a line up or down by one and keeps the focus on the button that moved it. */
  protected moveLine(index: number, delta: -1 | 1, event: Event): void {
    const lines = this.form().controls.lines;
    const target = index + delta;
    if (target < 0 || target >= lines.length) return;
    const line = lines.at(index);
    lines.removeAt(index, { emitEvent: false });
    lines.insert(target, line);
    this.form().markAsDirty();
    const label = (event.currentTarget as HTMLElement | null)?.getAttribute('data-move');
    afterNextRender(
      () => {
        // The same button on the moved line, or its other one at the top or bottom.
        const buttons = Array.from(
          this.host.nativeElement.querySelectorAll<HTMLButtonElement>(`[data-line="${target}"]`),
        ).filter((b) => !b.disabled);
        (buttons.find((b) => b.dataset['move'] === label) ?? buttons[0])?.focus();
      },
      { injector: this.injector },
    );
  }

  /** Converts a cup or spoon measure to grams and adds it as a line. */
  protected addFromVolume(): void {
    this.dialog
      .open<VolumeDialog, void, VolumeLine>(VolumeDialog, { width: '34rem' })
      .afterClosed()
      .subscribe((line) => {
        if (line) this.addLine({ ...line, percent: null });
      });
  }

  private focusMaterial(index: number): void {
    afterNextRender(
      () => {
        const inputs = this.host.nativeElement.querySelectorAll<HTMLInputElement>(
          'bp-material-picker input',
        );
        inputs[index]?.focus();
      },
      { injector: this.injector },
    );
  }
}
