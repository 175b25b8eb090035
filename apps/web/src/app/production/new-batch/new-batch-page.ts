import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  ElementRef,
  Injector,
  inject,
  input,
  signal,
  untracked,
} from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatAnchor, MatButton } from '@angular/material/button';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import { Router, RouterLink } from '@angular/router';
import { type BatchCreate, batchCreateSchema, MAX_PAGE_SIZE } from '@batchproof/shared';
import { provideCalendarDays } from '../../dates/calendar-day-adapter';
import { checkForm, errorMessage } from '../../forms/form-errors';
import { sendForm } from '../../forms/send-form';
import { messageOf } from '../../http/api-error';
import { SubmissionKey } from '../../http/submission-key';
import { FormulasApi } from '../../formulas/formulas-api';
import { isoDay } from '../../lots/lot-expiry';
import { BatchesApi } from '../batches-api';
import { focusFirstError } from '../focus-first-error';

/** Where the contract's fields live in this form (the version goes with the product). */
const mapPath = (path: string) => (path === 'version' ? 'formulaId' : path);

/**
 * Starts a batch (`/production/new?formula=<id>`): a product with a released formula version,
 * sized by units × unit mass (the unit mass prefilled from the version's profile) or by a total
 * in grams, plus a loss allowance, and the day it is made. Opens the new batch record.
 */
@Component({
  selector: 'bp-new-batch-page',
  imports: [
    MatAnchor,
    MatButton,
    MatButtonToggle,
    MatButtonToggleGroup,
    MatDatepickerModule,
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
  ],
  providers: [provideCalendarDays()],
  templateUrl: './new-batch-page.html',
  styleUrl: './new-batch-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class NewBatchPage {
  /** The formula to start with, from `?formula=`. */
  readonly formula = input<string>();

  private readonly batches = inject(BatchesApi);
  private readonly formulas = inject(FormulasApi);
  private readonly router = inject(Router);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly injector = inject(Injector);
  protected readonly errorMessage = errorMessage;
  protected readonly sending = signal(false);
  protected readonly notice = signal('');
  private readonly submission = new SubmissionKey();

  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly form = this.fb.group({
    formulaId: '',
    sizeBy: 'units' as 'units' | 'total',
    units: this.fb.control<number | null>(null),
    unitMass: this.fb.control<number | null>(null),
    totalGrams: this.fb.control<number | null>(null),
    lossPercent: this.fb.control<number | null>(0),
    madeOn: isoDay(new Date()),
  });

  /** Products that can be made: formulas with a released version, by name. */
  private readonly formulaPage = this.formulas.list(() => ({
    q: '',
    sort: 'name',
    dir: 'asc',
    page: 1,
    pageSize: MAX_PAGE_SIZE,
    includeArchived: false,
  }));
  protected readonly products = computed(() =>
    this.formulaPage.hasValue()
      ? this.formulaPage.value().items.filter((f) => f.releasedVersion !== null)
      : [],
  );
  protected readonly loadError = computed(() => {
    const error = this.formulaPage.error();
    return error ? messageOf(error) : '';
  });
  private readonly formulaId = signal('');
  protected readonly chosen = computed(
    () => this.products().find((p) => p.id === this.formulaId()) ?? null,
  );
  /** The chosen product's released version, for its unit mass. */
  private readonly version = this.formulas.version(() => {
    const p = this.chosen();
    return p && p.releasedVersion !== null ? { id: p.id, n: p.releasedVersion } : undefined;
  });
  protected readonly sizeBy = signal<'units' | 'total'>('units');

  constructor() {
    this.form.controls.formulaId.valueChanges.subscribe((id) => this.formulaId.set(id));
    this.form.controls.sizeBy.valueChanges.subscribe((s) => this.sizeBy.set(s));
    effect(() => {
      const preset = this.formula();
      if (preset) untracked(() => this.form.controls.formulaId.setValue(preset));
    });
    // The unit mass follows the released version's profile until the maker types their own.
    effect(() => {
      const mass = this.version.hasValue() ? this.version.value().profile.unitMassGrams : null;
      untracked(() => {
        const control = this.form.controls.unitMass;
        if (!control.dirty) control.setValue(mass);
      });
    });
  }

  /** The request body the form stands for. */
  private body(): BatchCreate {
    const v = this.form.getRawValue();
    const product = this.chosen();
    const size =
      v.sizeBy === 'units'
        ? { units: v.units ?? undefined, unitMass: v.unitMass ?? undefined }
        : { totalGrams: v.totalGrams ?? undefined };
    return {
      formulaId: v.formulaId,
      version: product?.releasedVersion ?? 0,
      ...size,
      lossPercent: v.lossPercent ?? 0,
      madeOn: v.madeOn || undefined,
    };
  }

  protected async submit(): Promise<void> {
    if (this.sending()) return;
    this.notice.set('');
    const body = this.body();
    const extra: Record<string, string[]> = this.chosen()
      ? {}
      : { formulaId: ['Choose a product with a released formula'] };
    const { value, notice } = checkForm(this.form, {
      schema: batchCreateSchema,
      body,
      mapPath,
      extra,
    });
    this.notice.set(notice);
    if (!value) {
      focusFirstError(this.host.nativeElement, this.injector);
      return;
    }
    const batch = await sendForm(
      this.form,
      this.batches.create(body, this.submission.for(body)),
      { sending: this.sending, notice: this.notice },
      mapPath,
    );
    if (!batch) {
      focusFirstError(this.host.nativeElement, this.injector);
      return;
    }
    this.submission.done();
    void this.router.navigate(['/production', batch.id], { replaceUrl: true });
  }
}
