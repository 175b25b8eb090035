import { DecimalPipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  inject,
  input,
  signal,
} from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { type ScaledVersion, scaleRequestSchema } from '@batchproof/shared';
import {
  checkForm,
  checkWhileTyping,
  contractErrors,
  errorMessage,
  filledInErrors,
  showRequestError,
} from '../../forms/form-errors';
import { FormulasApi } from '../formulas-api';

/**
 * Scales the saved version to a batch: a number of units × the unit mass, or a total mass, plus a
 * loss allowance for what sticks to bowls and moulds. Anyone who can read the formula may use it,
 * production included; it changes nothing. Sizes the contract refuses are refused beside their
 * field as they are typed, and a refused input takes the previous result away with it.
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

  constructor() {
    const refusals = () => contractErrors(scaleRequestSchema, this.body());
    const typing = checkWhileTyping(this.form, refusals);
    const clearing = this.form.valueChanges.subscribe(() => {
      if (Object.keys(filledInErrors(this.form, refusals())).length > 0) this.scaled.set(null);
    });
    inject(DestroyRef).onDestroy(() => {
      typing.unsubscribe();
      clearing.unsubscribe();
    });
  }

  protected chooseBy(by: 'units' | 'total'): void {
    this.by.set(by);
    this.form.controls.by.setValue(by);
  }

  protected scale(): void {
    if (this.busy()) return;
    const { value, notice } = checkForm(this.form, {
      schema: scaleRequestSchema,
      body: this.body(),
    });
    this.notice.set(notice);
    if (!value) {
      this.scaled.set(null);
      return;
    }
    this.busy.set(true);
    this.api.scale(this.formulaId(), this.version(), value).subscribe({
      next: (scaled) => {
        this.busy.set(false);
        this.scaled.set(scaled);
      },
      error: (err: unknown) => {
        this.busy.set(false);
        this.scaled.set(null);
        this.notice.set(showRequestError(this.form, err));
      },
    });
  }

  /** The scale request for what is entered; a blank unit mass uses the profile's. */
  private body() {
    const v = this.form.getRawValue();
    const unitMass = v.unitMassGrams ?? this.unitMassGrams() ?? undefined;
    return v.by === 'units'
      ? { units: v.units, unitMassGrams: unitMass, lossPercent: v.lossPercent ?? 0 }
      : { totalGrams: v.totalGrams, lossPercent: v.lossPercent ?? 0 };
  }
}
