import {
  ChangeDetectionStrategy,
  Component,
  computed,
  DestroyRef,
  effect,
  inject,
  input,
  signal,
  untracked,
} from '@angular/core';
import { takeUntilDestroyed, toObservable } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import { pairwise, startWith, switchMap } from 'rxjs';
import { labelStockCreateSchema, ROLE_SETS } from '@batchproof/shared';
import { Session } from '../../auth/session';
import { checkForm, errorMessage } from '../../forms/form-errors';
import { sendForm } from '../../forms/send-form';
import { type LeavesSafely, warnBeforeUnload } from '../../forms/unsaved-changes';
import { messageOf } from '../../http/api-error';
import { SubmissionKey } from '../../http/submission-key';
import { LabelStocksApi } from '../label-stocks-api';
import { CalibrationDownload } from '../calibration-download';
import {
  convertLengths,
  createStockForm,
  LENGTH_HINTS,
  LENGTH_LABELS,
  PAGE_PRESETS,
  ROLL_LENGTHS,
  SHEET_LENGTHS,
  setPage,
  stockBody,
  stockFormPath,
  type StockValue,
} from './stock-form-model';

/**
 * Adds a label stock of the workshop's own, or changes one: sheet or roll, every length in
 * millimetres or inches, checked with the shared `labelStockCreateSchema` the API also uses. A
 * built-in stock opens read-only. Each stock has a calibration page to check the printer with.
 */
@Component({
  selector: 'bp-label-stock-form',
  imports: [
    CalibrationDownload,
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatButtonToggle,
    MatButtonToggleGroup,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatProgressBar,
    MatSelect,
  ],
  templateUrl: './label-stock-form.html',
  styleUrl: './label-stock-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class LabelStockForm implements LeavesSafely {
  /** The stock's id from the path; absent for a new stock. */
  readonly id = input<string>();

  private readonly api = inject(LabelStocksApi);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  private readonly session = inject(Session);
  private readonly submission = new SubmissionKey();
  protected readonly errorMessage = errorMessage;
  protected readonly presets = PAGE_PRESETS;

  protected readonly record = this.api.stock(() => this.id());
  protected readonly builtIn = computed(
    () => this.record.hasValue() && this.record.value().builtIn,
  );
  protected readonly canWrite = computed(
    () => this.session.hasRole(ROLE_SETS.writers) && !this.builtIn(),
  );
  protected readonly saving = signal(false);
  protected readonly notice = signal('');
  private readonly state = { sending: this.saving, notice: this.notice };
  protected readonly loadError = computed(() => {
    const error = this.record.error();
    return error ? messageOf(error) : '';
  });

  /** The form: empty for a new stock, filled from the stock once it is read. */
  protected readonly form = computed(() => {
    if (this.id() && !this.record.hasValue()) return undefined;
    const stock = this.id() ? this.record.value()!.stock : null;
    return untracked(() => createStockForm(this.fb, stock));
  });
  /** What the form holds now, so the template follows the kind, shape and unit chosen. */
  protected readonly value = signal<StockValue | null>(null);

  /** The length fields the chosen kind and shape have, in the order a ruler measures them. */
  protected readonly lengths = computed(() => {
    const f = this.form();
    const v = this.value();
    if (!f || !v) return [];
    const keys = [
      ...(v.shapeKind === 'rounded-rectangle' ? (['cornerRadiusMm'] as const) : []),
      ...(v.kind === 'sheet' ? SHEET_LENGTHS : ROLL_LENGTHS),
    ];
    return keys.map((key) => ({
      key,
      label: LENGTH_LABELS[key],
      hint: LENGTH_HINTS[key],
      control: f.controls[key],
    }));
  });

  constructor() {
    const destroyRef = inject(DestroyRef);
    // Lengths follow the unit: switching to inches rewrites every length typed so far.
    toObservable(this.form)
      .pipe(
        switchMap((f) => {
          if (!f) return [];
          return f.controls.unit.valueChanges.pipe(startWith(f.controls.unit.value), pairwise());
        }),
        takeUntilDestroyed(destroyRef),
      )
      .subscribe(([from, to]) => convertLengths(this.form()!, from, to));
    effect((onCleanup) => {
      const f = this.form();
      if (!f) return;
      if (!this.canWrite()) f.disable({ emitEvent: false });
      untracked(() => this.value.set(f.getRawValue()));
      const sub = f.valueChanges.subscribe(() => this.value.set(f.getRawValue()));
      onCleanup(() => sub.unsubscribe());
    });
    warnBeforeUnload(() => this.hasUnsavedChanges());
  }

  protected usePage(page: { widthMm: number; heightMm: number }): void {
    setPage(this.form()!, page);
  }

  hasUnsavedChanges(): boolean {
    return this.canWrite() && !!this.form()?.dirty;
  }

  saveChanges(): Promise<boolean> {
    return this.save();
  }

  /** Checks the stock with the shared schema and saves it; resolves whether it was saved. */
  async save(): Promise<boolean> {
    const form = this.form();
    if (!form || this.saving()) return false;
    this.notice.set('');
    const { value, notice } = checkForm(form, {
      schema: labelStockCreateSchema,
      body: stockBody(form.getRawValue()),
      mapPath: stockFormPath,
    });
    if (!value) {
      this.notice.set(notice || 'Some fields need attention; each says why below it.');
      return false;
    }
    const id = this.id();
    const request = id
      ? this.api.update(id, value)
      : this.api.create(value, this.submission.for(value));
    const saved = await sendForm(form, request, this.state, stockFormPath);
    if (!saved) return false;
    this.submission.done();
    this.snackBar.open(`${saved.stock.name} is saved.`, 'OK', { duration: 4000 });
    if (!id) void this.router.navigate(['/labels/stocks', saved.id], { replaceUrl: true });
    return true;
  }
}
