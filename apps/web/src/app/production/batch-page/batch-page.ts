import { DecimalPipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  ElementRef,
  inject,
  Injector,
  input,
  signal,
  untracked,
} from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatAnchor, MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import {
  type Batch,
  batchReadyOn,
  batchRecordInputSchema,
  checkUnitWeights,
  checkWeighing,
  ROLE_SETS,
} from '@batchproof/shared';
import { Session } from '../../auth/session';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';
import { saveFile } from '../../documents/save-file';
import { checkForm, errorMessage, showRequestError } from '../../forms/form-errors';
import { sendForm } from '../../forms/send-form';
import { warnBeforeUnload, type LeavesSafely } from '../../forms/unsaved-changes';
import { FormulasApi } from '../../formulas/formulas-api';
import { ApiError, messageOf } from '../../http/api-error';
import { CHECK_WORDS, STATE_WORDS } from '../batch-words';
import { BatchesApi } from '../batches-api';
import { focusFirstError } from '../focus-first-error';
import { LotChoices } from '../lot-choices';
import { AmendmentForm } from './amendment-form';
import { batchForm, type BatchForm, readUnitWeights, recordBody, recordPath } from './batch-form';
import { BatchRecordView } from './batch-record-view';
import { confirmFirst } from '../../forms/confirm-dialog';
import { WeighSheet } from './weigh-sheet';

/**
 * One batch record (`/production/:id`). A draft is recorded by production, a formulator or the
 * owner (weights, lots, conditions, checks) and released by a formulator or the owner; a released
 * batch is read-only and takes corrections as amendments, shown beside the original values.
 */
@Component({
  selector: 'bp-batch-page',
  imports: [
    AmendmentForm,
    BatchRecordView,
    CalendarDayPipe,
    DecimalPipe,
    MatAnchor,
    MatButton,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatProgressBar,
    MatSelect,
    MatSuffix,
    ReactiveFormsModule,
    RouterLink,
    WeighSheet,
  ],
  providers: [LotChoices],
  templateUrl: './batch-page.html',
  styleUrl: './batch-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class BatchPage implements LeavesSafely {
  /** The batch's id from the path. */
  readonly id = input.required<string>();

  private readonly api = inject(BatchesApi);
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly injector = inject(Injector);
  protected readonly errorMessage = errorMessage;
  protected readonly stateWords = STATE_WORDS;
  protected readonly checkWords = CHECK_WORDS;
  protected readonly checkKeys = [
    { key: 'appearance', label: 'Appearance' },
    { key: 'hardness', label: 'Hardness' },
    { key: 'fizzOrLather', label: 'Fizz or lather' },
  ] as const;

  protected readonly canRecord = computed(() => this.session.hasRole(ROLE_SETS.goodsIn));
  protected readonly canRelease = computed(() => this.session.hasRole(ROLE_SETS.writers));

  protected readonly batchResource = this.api.batch(this.id);
  protected readonly batch = computed<Batch | null>(() =>
    this.batchResource.hasValue() ? this.batchResource.value() : null,
  );
  protected readonly loadError = computed(() => {
    const error = this.batchResource.error();
    return error ? messageOf(error) : '';
  });
  /** Whether the record can be edited here: a draft, for those who record batches. */
  protected readonly editable = computed(() => this.batch()?.state === 'draft' && this.canRecord());
  /** The formula version the batch is made from: its declared net quantity, for the unit weights. */
  private readonly version = inject(FormulasApi).version(() => {
    const b = this.batch();
    return b ? { id: b.formulaId, n: b.version } : undefined;
  });

  /** The record's form, built afresh from each batch the API answers with. */
  protected readonly form = computed<BatchForm | null>(() => {
    const b = this.batch();
    if (!b || !this.editable()) return null;
    return untracked(() => batchForm(this.fb, b));
  });
  /** The form's value as typed, for the live checks. */
  private readonly typed = signal(0);

  protected readonly sending = signal(false);
  protected readonly notice = signal('');
  private readonly state = { sending: this.sending, notice: this.notice };
  private deleted = false;
  protected readonly amending = signal(false);

  /** Each line's weight against its target at the batch's tolerance, as typed. */
  protected readonly weighing = computed(() => {
    const b = this.batch();
    if (!b) return [];
    this.typed();
    const values = this.form()?.controls.lines.getRawValue();
    return checkWeighing(
      b.lines.map((line, i) => ({
        name: line.usedMaterialName,
        targetGrams: line.weighGrams,
        actualGrams: values ? (values[i]?.actualGrams ?? null) : line.actualGrams,
      })),
      b.tolerancePercent,
    );
  });
  protected readonly outOfTolerance = computed(
    () => this.weighing().filter((c) => c.status === 'out').length,
  );
  /** The day the batch is ready, from the timing as typed. */
  protected readonly readyOn = computed(() => {
    const b = this.batch();
    if (!b) return null;
    this.typed();
    const timing = this.form()?.controls.timing.getRawValue();
    return timing
      ? batchReadyOn(b.madeOn, timing.hoursInMould, timing.curingDays)
      : b.timing.readyOn;
  });
  /** The unit weights as typed against the declared net quantity (grams only). */
  protected readonly unitWeightCheck = computed(() => {
    const b = this.batch();
    if (!b) return null;
    this.typed();
    const form = this.form();
    if (!form) return b.checks.unitWeight;
    const net = this.version.hasValue() ? this.version.value().profile.netQuantity : null;
    const weights = readUnitWeights(form.controls.checks.controls.unitWeightsGrams.value);
    if (!net || net.unit !== 'g' || weights.length === 0 || weights.some((w) => !(w > 0)))
      return null;
    return checkUnitWeights(weights, net.amount);
  });

  constructor() {
    warnBeforeUnload(() => this.hasUnsavedChanges());
    effect((onCleanup) => {
      const form = this.form();
      if (!form) return;
      const sub = form.valueChanges.subscribe(() => this.typed.update((n) => n + 1));
      onCleanup(() => sub.unsubscribe());
    });
  }

  hasUnsavedChanges(): boolean {
    return !this.deleted && !!this.form()?.dirty;
  }

  saveChanges(): Promise<boolean> {
    return this.save();
  }

  /** Checks the record with the shared contract and saves the draft; resolves whether it saved. */
  protected async save(): Promise<boolean> {
    const form = this.form();
    const b = this.batch();
    if (!form || !b || this.sending()) return false;
    this.notice.set('');
    const body = recordBody(form, b);
    const { value, notice } = checkForm(form, {
      schema: batchRecordInputSchema,
      body,
      mapPath: recordPath,
    });
    if (!value) {
      this.notice.set(notice);
      this.focusError();
      return false;
    }
    const saved = await sendForm(form, this.api.record(b.id, body), this.state, recordPath);
    if (!saved) {
      this.focusError();
      return false;
    }
    this.batchResource.set(saved);
    this.snackBar.open(`Batch ${saved.batchCode} is saved.`, 'OK', { duration: 4000 });
    return true;
  }

  /** Saves what is typed, then releases; a refusal puts its messages on the lines. */
  protected async release(): Promise<void> {
    const b = this.batch();
    if (!b || this.sending()) return;
    if (this.form()?.dirty && !(await this.save())) return;
    this.notice.set('');
    this.sending.set(true);
    this.api.release(b.id).subscribe({
      next: (released) => {
        this.sending.set(false);
        this.batchResource.set(released);
        this.snackBar.open(`Batch ${released.batchCode} is released.`, 'OK', { duration: 5000 });
      },
      error: (err: unknown) => {
        this.sending.set(false);
        const form = this.form();
        if (form && err instanceof ApiError)
          this.notice.set(showRequestError(form, err, recordPath));
        else this.notice.set(messageOf(err));
        this.focusError();
      },
    });
  }

  protected confirmDelete(b: Batch): void {
    this.notice.set('');
    confirmFirst(this.dialog, {
      title: `Delete draft batch ${b.batchCode}?`,
      message:
        'Its weigh sheet and everything recorded on it go away. No stock was taken yet: lots are ' +
        'drawn down only when a batch is released.',
      keep: 'Keep',
      confirm: 'Delete draft',
    }).subscribe((confirmed) => {
      if (!confirmed) return;
      this.sending.set(true);
      this.api.remove(b.id).subscribe({
        next: () => {
          this.sending.set(false);
          this.deleted = true;
          this.snackBar.open(`Draft batch ${b.batchCode} is deleted.`, 'OK', { duration: 5000 });
          void this.router.navigateByUrl('/production');
        },
        error: (err: unknown) => {
          this.sending.set(false);
          this.notice.set(messageOf(err));
        },
      });
    });
  }

  protected downloadSheet(b: Batch): void {
    this.sending.set(true);
    this.api.weighSheet(b.id).subscribe({
      next: (pdf) => {
        this.sending.set(false);
        saveFile(pdf, `weigh-sheet-${b.batchCode}.pdf`);
      },
      error: (err: unknown) => {
        this.sending.set(false);
        this.snackBar.open(messageOf(err), 'OK', { duration: 8000 });
      },
    });
  }

  protected onAmended(b: Batch): void {
    this.batchResource.set(b);
    this.amending.set(false);
  }

  private focusError(): void {
    focusFirstError(this.host.nativeElement, this.injector);
  }
}
