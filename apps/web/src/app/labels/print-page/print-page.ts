import { DOCUMENT } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  signal,
  untracked,
} from '@angular/core';
import { httpResource } from '@angular/common/http';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatRadioButton, MatRadioGroup } from '@angular/material/radio';
import { MatCheckbox } from '@angular/material/checkbox';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { formValue } from '../../forms/form-value';
import {
  batchSchema,
  type ComplianceMarket,
  labelRunCreateSchema,
  type LabelRunRecord,
  ROLE_SETS,
} from '@batchproof/shared';
import { Session } from '../../auth/session';
import { provideCalendarDays } from '../../dates/calendar-day-adapter';
import { checkForm, errorMessage, showRequestError } from '../../forms/form-errors';
import { FormulasApi } from '../../formulas/formulas-api';
import { MARKETS } from '../../formulas/product-types';
import { ApiError, messageOf } from '../../http/api-error';
import { SubmissionKey } from '../../http/submission-key';
import { LabelRunsApi } from '../label-runs-api';
import { BARCODE_NAMES, LAYOUT_NAMES } from '../label-run-words';
import { LabelStocksApi } from '../label-stocks-api';
import { createPrintForm, MOVABLE_FIELDS, type PrintForm, printBody } from './print-form';
import { AssessmentFindings } from '../../formulas/live-checks/assessment-findings';
import { RunPreview } from './run-preview';
import { RunRefusal } from './run-refusal';
import { StartPositionGrid } from './start-position-grid';

const MARKET_NAMES = new Map(MARKETS.map((m) => [m.code, m.name]));

/**
 * Prints labels for a released formula version (`/labels/print?formula=<id>&version=<n>`), or
 * for a released batch (`/labels/print?batch=<id>`: the formula, the version it was made of, the
 * lot code and the expiry come from the batch, and production may print it):
 * markets, stock, layout, start position on a part-used sheet, copies, lot code, expiry and
 * barcode, checked with the shared `labelRunCreateSchema`. A refusal lists what is missing per
 * market with links to the fields, or what cannot fit; a run shows its progress, then its PDF.
 */
@Component({
  selector: 'bp-print-page',
  imports: [
    AssessmentFindings,
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatRadioButton,
    MatRadioGroup,
    MatCheckbox,
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
    RunPreview,
    RunRefusal,
    StartPositionGrid,
  ],
  providers: [provideCalendarDays()],
  templateUrl: './print-page.html',
  styleUrl: './print-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class PrintPage {
  /** The formula's id, from the `formula` query parameter. */
  readonly formula = input<string>();
  /** The released version's number, from the `version` query parameter. */
  readonly version = input<string>();
  /** A batch to print for, from the `batch` query parameter; it fixes formula, version and lot. */
  readonly batch = input<string>();

  private readonly fb = inject(NonNullableFormBuilder);
  private readonly runsApi = inject(LabelRunsApi);
  private readonly formulasApi = inject(FormulasApi);
  private readonly session = inject(Session);
  private readonly document = inject(DOCUMENT);
  private readonly submission = new SubmissionKey();
  protected readonly errorMessage = errorMessage;
  protected readonly layouts = LAYOUT_NAMES;
  protected readonly barcodes = BARCODE_NAMES;
  protected readonly movable = MOVABLE_FIELDS;
  protected readonly marketNames = MARKET_NAMES;

  /** The batch printed for, read while the `batch` parameter names one. */
  protected readonly batchRecord = httpResource(
    () => {
      const id = this.batch();
      return id ? `/api/batches/${encodeURIComponent(id)}` : undefined;
    },
    { parse: (body) => batchSchema.parse(body) },
  );
  protected readonly forBatch = computed(() =>
    this.batch() && this.batchRecord.hasValue() ? this.batchRecord.value() : undefined,
  );
  /** Production prints for a batch; the owner and formulators print for either. */
  protected readonly canPrint = computed(() =>
    this.session.hasRole(this.batch() ? ROLE_SETS.goodsIn : ROLE_SETS.writers),
  );
  protected readonly isOwner = computed(() => this.session.hasRole(ROLE_SETS.ownerOnly));
  /** The formula printed: the batch's, else the `formula` parameter. */
  protected readonly formulaId = computed(() =>
    this.batch() ? this.forBatch()?.formulaId : this.formula(),
  );
  protected readonly number = computed(() => {
    if (this.batch()) return this.forBatch()?.version;
    const n = Number(this.version());
    return Number.isInteger(n) && n > 0 ? n : undefined;
  });
  protected readonly formulaMeta = this.formulasApi.formula(() => this.formulaId());
  protected readonly versionRecord = this.formulasApi.version(() => {
    const id = this.formulaId();
    const n = this.number();
    return id && n ? { id, n } : undefined;
  });
  protected readonly stocks = inject(LabelStocksApi).stocks();
  protected readonly loadError = computed(() => {
    const error =
      this.batchRecord.error() ??
      this.formulaMeta.error() ??
      this.versionRecord.error() ??
      this.stocks.error();
    return error ? messageOf(error) : '';
  });
  /** Whether labels may be printed from here: a released version, or a released batch. */
  protected readonly released = computed(() => {
    if (!this.versionRecord.hasValue()) return false;
    // A batch prints from the version it was made of, even once a newer one is released.
    if (this.batch()) return this.forBatch()?.state === 'released';
    return this.versionRecord.value().state === 'released';
  });

  /** The form, built once the version and the stocks are read. */
  protected readonly form = computed(() => {
    if (!this.versionRecord.hasValue() || !this.stocks.hasValue()) return undefined;
    if (this.batch() && !this.forBatch()) return undefined;
    const markets = this.versionRecord.value().profile.markets;
    const first = this.stocks.value()[0]?.id ?? '';
    const batch = this.forBatch();
    const lot = batch
      ? { batchCode: batch.batchCode, expiresOn: batch.durability.expiresOn }
      : undefined;
    return untracked(() => createPrintForm(this.fb, markets, first, lot));
  });
  /** The form's value as it changes, for the parts of the page that follow it. */
  protected readonly value = formValue(this.form);
  protected readonly stock = computed(() => {
    const id = this.value()?.stockId;
    const all = this.stocks.hasValue() ? this.stocks.value() : [];
    return all.find((s) => s.id === id)?.stock;
  });
  protected readonly sheet = computed(() => {
    const s = this.stock();
    return s?.kind === 'sheet' ? s : undefined;
  });

  protected readonly sending = signal(false);
  protected readonly notice = signal('');
  /** The last refusal with missing elements or fit problems, shown until the next print. */
  protected readonly refusal = signal<ApiError | null>(null);
  /** The run recorded, shown with its progress and then its PDF. */
  protected readonly run = signal<LabelRunRecord | null>(null);

  constructor() {
    // A start position beyond the chosen sheet's last goes back to the first.
    effect(() => {
      const f = this.form();
      const sheet = this.sheet();
      if (!f) return;
      const last = sheet ? sheet.across * sheet.down : 1;
      untracked(() => {
        if (f.controls.startPosition.value > last) f.controls.startPosition.setValue(1);
      });
    });
  }

  protected marketChecked(market: ComplianceMarket): boolean {
    return this.value()?.markets.includes(market) ?? false;
  }

  protected toggleMarket(form: PrintForm, market: ComplianceMarket, checked: boolean): void {
    const now = form.controls.markets.value.filter((m) => m !== market);
    form.controls.markets.setValue(checked ? [...now, market] : now);
    form.controls.markets.markAsTouched();
  }

  protected setStart(form: PrintForm, position: number): void {
    form.controls.startPosition.setValue(position);
  }

  /** Moves focus to a field of this form, for a refusal's "Fill it in". */
  protected focusField(id: string): void {
    const target = this.document.getElementById(id);
    target?.scrollIntoView?.({ block: 'center' });
    target?.focus();
  }

  /** Checks the form with the shared schema and records the run (with the owner's reason). */
  print(overrideReason?: string): void {
    const form = this.form();
    const formulaId = this.formulaId();
    const version = this.number();
    if (!form || !formulaId || !version || this.sending()) return;
    this.notice.set('');
    const run = { formulaId, version, overrideReason, batchId: this.forBatch()?.id };
    const { value, notice } = checkForm(form, {
      schema: labelRunCreateSchema,
      body: printBody(form, run),
    });
    if (!value) {
      this.notice.set(notice || 'Some fields need attention; each says why below it.');
      return;
    }
    const body = printBody(form, run);
    this.sending.set(true);
    this.run.set(null);
    this.runsApi.create(body, this.submission.for(body)).subscribe({
      next: (run) => {
        this.sending.set(false);
        this.submission.done();
        this.refusal.set(null);
        this.run.set(run);
      },
      error: (err: unknown) => {
        this.sending.set(false);
        if (
          err instanceof ApiError &&
          (err.code === 'label_incomplete' || err.code === 'label_does_not_fit')
        ) {
          this.refusal.set(err);
          return;
        }
        this.refusal.set(null);
        this.notice.set(showRequestError(form, err));
      },
    });
  }
}
