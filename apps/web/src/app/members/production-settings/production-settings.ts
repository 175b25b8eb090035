import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  signal,
  untracked,
} from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatRadioButton, MatRadioGroup } from '@angular/material/radio';
import { MatSnackBar } from '@angular/material/snack-bar';
import {
  batchCodeProblem,
  formatBatchCode,
  productionSettingsSchema,
  ROLE_SETS,
} from '@batchproof/shared';
import { Session } from '../../auth/session';
import { errorMessage, validateForm } from '../../forms/form-errors';
import { sendForm } from '../../forms/send-form';
import { messageOf } from '../../http/api-error';
import { isoDay } from '../../lots/lot-expiry';
import { ProductionSettingsApi } from './production-settings-api';

/** The product code and sequence the pattern's example is shown with (a fictional product). */
const EXAMPLE = { productCode: 'SGF', sequence: 7 } as const;

/**
 * The workshop's production settings card: the weighing tolerance new batches take, the batch
 * code pattern with a live example and its problems, and whether the business is a small
 * business under MoCRA. The owner edits; other members read.
 */
@Component({
  selector: 'bp-production-settings',
  imports: [
    MatButton,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatProgressBar,
    MatRadioButton,
    MatRadioGroup,
    MatSuffix,
    ReactiveFormsModule,
  ],
  templateUrl: './production-settings.html',
  styleUrl: './production-settings.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProductionSettingsCard {
  private readonly api = inject(ProductionSettingsApi);
  private readonly session = inject(Session);
  private readonly snackBar = inject(MatSnackBar);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly errorMessage = errorMessage;
  protected readonly isOwner = computed(() => this.session.hasRole(ROLE_SETS.ownerOnly));
  protected readonly settings = this.api.settings();
  protected readonly saving = signal(false);
  protected readonly notice = signal('');
  protected readonly loadError = computed(() => {
    const error = this.settings.error();
    return error ? messageOf(error) : '';
  });

  protected readonly form = this.fb.group({
    weighingTolerancePercent: this.fb.control<number | null>(null),
    batchCodePattern: '',
    smallBusiness: false,
  });
  private readonly pattern = toSignal(this.form.controls.batchCodePattern.valueChanges, {
    initialValue: '',
  });
  /** The pattern as typed, on today's date: an example code, or why it cannot make one. */
  protected readonly example = computed(() => {
    const input = { day: isoDay(new Date()), ...EXAMPLE };
    const pattern = this.pattern();
    const problem = batchCodeProblem(pattern, input);
    return problem
      ? { code: null, problem }
      : { code: formatBatchCode(pattern, input), problem: null };
  });

  constructor() {
    effect(() => {
      if (!this.settings.hasValue()) return;
      const s = this.settings.value();
      untracked(() => {
        this.form.reset(s);
        if (!this.isOwner()) this.form.disable();
      });
    });
  }

  /** Whether the form holds changes not saved yet. */
  hasUnsavedChanges(): boolean {
    return this.isOwner() && this.form.dirty;
  }

  protected async save(): Promise<void> {
    if (this.saving()) return;
    this.notice.set('');
    const value = validateForm(this.form, productionSettingsSchema);
    if (!value) return;
    const saved = await sendForm(this.form, this.api.save(value), {
      sending: this.saving,
      notice: this.notice,
    });
    if (saved) {
      this.settings.set(saved);
      this.snackBar.open('The production settings are saved.', 'OK', { duration: 4000 });
    }
  }
}
