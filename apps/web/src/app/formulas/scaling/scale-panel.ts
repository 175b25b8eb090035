import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, input, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { type ScaledVersion, scaleRequestSchema } from '@batchproof/shared';
import { errorMessage } from '../../forms/form-errors';
import { showContractRequestError, validateContract } from '../form-paths';
import { FormulasApi } from '../formulas-api';

/**
 * Scales the saved version to a batch: a number of units × the unit mass, or a total mass, plus a
 * loss allowance for what sticks to bowls and moulds. Anyone who can read the formula may use it,
 * production included; it changes nothing.
 */
@Component({
  selector: 'bp-scale-panel',
  imports: [
    DecimalPipe,
    ReactiveFormsModule,
    MatButton,
    MatButtonToggle,
    MatButtonToggleGroup,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatProgressBar,
    MatSuffix,
  ],
  templateUrl: './scale-panel.html',
  styleUrl: './scale-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ScalePanel {
  readonly formulaId = input.required<string>();
  readonly version = input.required<number>();
  /** The version's unit mass, offered as the default. */
  readonly unitMassGrams = input<number | null>(null);

  private readonly api = inject(FormulasApi);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly form = this.fb.group({
    by: 'units' as 'units' | 'total',
    units: this.fb.control<number | null>(12),
    unitMassGrams: this.fb.control<number | null>(null),
    totalGrams: this.fb.control<number | null>(null),
    lossPercent: this.fb.control<number | null>(3),
  });
  protected readonly by = signal<'units' | 'total'>('units');
  protected readonly scaled = signal<ScaledVersion | null>(null);
  protected readonly busy = signal(false);
  protected readonly notice = signal('');
  protected readonly errorMessage = errorMessage;

  protected chooseBy(by: 'units' | 'total'): void {
    this.by.set(by);
    this.form.controls.by.setValue(by);
  }

  protected scale(): void {
    if (this.busy()) return;
    const v = this.form.getRawValue();
    const unitMass = v.unitMassGrams ?? this.unitMassGrams() ?? undefined;
    const body =
      v.by === 'units'
        ? { units: v.units, unitMassGrams: unitMass, lossPercent: v.lossPercent ?? 0 }
        : { totalGrams: v.totalGrams, lossPercent: v.lossPercent ?? 0 };
    const { value, notice } = validateContract(this.form, scaleRequestSchema, body, (p) => p);
    this.notice.set(notice);
    if (!value) return;
    this.busy.set(true);
    this.api.scale(this.formulaId(), this.version(), value).subscribe({
      next: (scaled) => {
        this.busy.set(false);
        this.scaled.set(scaled);
      },
      error: (err: unknown) => {
        this.busy.set(false);
        this.notice.set(showContractRequestError(this.form, err, (p) => p));
      },
    });
  }
}
