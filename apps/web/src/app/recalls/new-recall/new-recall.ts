import {
  ChangeDetectionStrategy,
  Component,
  computed,
  ElementRef,
  inject,
  Injector,
  input,
  signal,
} from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatAnchor, MatButton } from '@angular/material/button';
import { MatCheckbox } from '@angular/material/checkbox';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatRadioButton, MatRadioGroup } from '@angular/material/radio';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import {
  RECALL_AUTHORITY_NOTE,
  RECALL_SEVERITIES,
  RECALL_SEVERITY_LABELS,
  recallConcernsHarm,
  recallCreateSchema,
  type RecallScope,
  type RecallSeverity,
} from '@batchproof/shared';
import { checkForm, errorMessage } from '../../forms/form-errors';
import { sendForm } from '../../forms/send-form';
import type { LeavesSafely } from '../../forms/unsaved-changes';
import { messageOf } from '../../http/api-error';
import { SubmissionKey } from '../../http/submission-key';
import { focusFirstError } from '../../production/focus-first-error';
import { AffectedCustomers } from '../affected-customers';
import { RecallsApi } from '../recalls-api';

/**
 * Opening a recall or a drill from a trace (`/recalls/new?supplierLot=<id>` or
 * `?finishedLots=<id>,<id>`): what it covers and whom it reaches are shown before it is opened.
 */
@Component({
  selector: 'bp-new-recall',
  imports: [
    AffectedCustomers,
    MatAnchor,
    MatButton,
    MatCheckbox,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatProgressBar,
    MatRadioButton,
    MatRadioGroup,
    ReactiveFormsModule,
    RouterLink,
  ],
  templateUrl: './new-recall.html',
  styleUrl: './new-recall.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class NewRecall implements LeavesSafely {
  /** The supplier lot to recall everything made with, from the query. */
  readonly supplierLot = input<string>();
  /** Finished lots (batch ids) to recall, comma-separated, from the query. */
  readonly finishedLots = input<string>();

  private readonly api = inject(RecallsApi);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly injector = inject(Injector);
  private readonly submission = new SubmissionKey();

  protected readonly severities = RECALL_SEVERITIES.map((value) => ({
    value,
    label: RECALL_SEVERITY_LABELS[value],
  }));
  protected readonly authorityNote = RECALL_AUTHORITY_NOTE;

  protected readonly scope = computed<RecallScope | undefined>(() => {
    const lot = this.supplierLot();
    if (lot) return { kind: 'supplier-lot', supplierLotId: lot };
    const ids = (this.finishedLots() ?? '').split(',').filter(Boolean);
    return ids.length > 0 ? { kind: 'finished-lots', finishedLotIds: ids } : undefined;
  });
  protected readonly preview = this.api.preview(this.scope);
  protected readonly previewError = computed(() => {
    const error = this.preview.error();
    return error ? messageOf(error) : '';
  });
  protected readonly noEmail = computed(() =>
    this.preview.hasValue() ? this.preview.value().affected.filter((c) => !c.email) : [],
  );

  protected readonly form = inject(FormBuilder).nonNullable.group({
    reason: '',
    severity: '' as RecallSeverity | '',
    drill: false,
  });
  private readonly severity = toSignal(this.form.controls.severity.valueChanges, {
    initialValue: this.form.controls.severity.value,
  });
  protected readonly concernsHarm = computed(() => {
    const s = this.severity();
    return s !== '' && recallConcernsHarm(s);
  });
  protected readonly drill = toSignal(this.form.controls.drill.valueChanges, {
    initialValue: false,
  });
  protected readonly sending = signal(false);
  protected readonly notice = signal('');
  protected readonly errorMessage = errorMessage;

  hasUnsavedChanges(): boolean {
    return this.form.dirty;
  }

  saveChanges(): Promise<boolean> {
    return this.submit();
  }

  /** Checks the form with the shared contract and opens the recall; resolves whether it did. */
  async submit(): Promise<boolean> {
    if (this.sending()) return false;
    const scope = this.scope();
    const body = { ...this.form.getRawValue(), scope };
    const { value, notice } = checkForm(this.form, { schema: recallCreateSchema, body });
    this.notice.set(notice);
    if (!value) {
      focusFirstError(this.host.nativeElement, this.injector);
      return false;
    }
    const recall = await sendForm(this.form, this.api.open(value, this.submission.for(value)), {
      sending: this.sending,
      notice: this.notice,
    });
    if (!recall) {
      focusFirstError(this.host.nativeElement, this.injector);
      return false;
    }
    this.submission.done();
    this.snackBar.open(recall.drill ? 'The drill is started.' : 'The recall is open.', 'OK', {
      duration: 5000,
    });
    void this.router.navigate(['/recalls', recall.id], { replaceUrl: true });
    return true;
  }
}
