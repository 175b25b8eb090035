import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  linkedSignal,
  signal,
  untracked,
} from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatAutocompleteModule } from '@angular/material/autocomplete';
import { MatAnchor, MatButton } from '@angular/material/button';
import { MatCheckbox } from '@angular/material/checkbox';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect, MatSelectTrigger } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import {
  BODY_AREA_SUGGESTIONS,
  type Complaint,
  complaintCreateSchema,
  ROLE_SETS,
  SERIOUS_ADVERSE_EVENT_DEFINITION_SOURCE,
  SERIOUS_ADVERSE_EVENT_HELP,
  todayIso,
} from '@batchproof/shared';
import { Session } from '../../auth/session';
import { browserLocale, provideCalendarDays } from '../../dates/calendar-day-adapter';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';
import { errorMessage, validateForm } from '../../forms/form-errors';
import { sendForm } from '../../forms/send-form';
import type { LeavesSafely } from '../../forms/unsaved-changes';
import { messageOf } from '../../http/api-error';
import { SubmissionKey } from '../../http/submission-key';
import { ComplaintsApi } from '../complaints-api';
import { reportingDeadline } from '../reporting-deadline';

/**
 * One complaint (`/complaints/:id`) or a new one (`/complaints/new`): the form for those who log
 * complaints (owner, formulator, production), with the US reporting clock and how long the
 * record is kept.
 */
@Component({
  selector: 'bp-complaint-page',
  imports: [
    CalendarDayPipe,
    MatAnchor,
    MatAutocompleteModule,
    MatButton,
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
    MatSelectTrigger,
    MatSuffix,
    ReactiveFormsModule,
    RouterLink,
  ],
  providers: [provideCalendarDays()],
  templateUrl: './complaint-page.html',
  styleUrl: './complaint-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class ComplaintPage implements LeavesSafely {
  /** The complaint's id from the path; absent on `/complaints/new`. */
  readonly id = input<string>();

  private readonly api = inject(ComplaintsApi);
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);
  private readonly fb = inject(NonNullableFormBuilder);
  /** Dates read in the browser's language, as the day pipe shows them. */
  private readonly locale = browserLocale();
  private readonly submission = new SubmissionKey();

  protected readonly help = SERIOUS_ADVERSE_EVENT_HELP;
  protected readonly helpSource = SERIOUS_ADVERSE_EVENT_DEFINITION_SOURCE;
  protected readonly bodyAreas = BODY_AREA_SUGGESTIONS;
  protected readonly errorMessage = errorMessage;
  protected readonly canRecord = computed(() => this.session.hasRole(ROLE_SETS.goodsIn));
  protected readonly sending = signal(false);
  protected readonly notice = signal('');

  protected readonly resource = this.api.complaint(this.id);
  /** The complaint as last read or saved. */
  protected readonly complaint = computed<Complaint | null>(() =>
    this.resource.hasValue() ? this.resource.value() : null,
  );
  protected readonly loadError = computed(() => {
    const error = this.resource.error();
    return error ? messageOf(error) : '';
  });
  protected readonly products = this.api.products();

  /** The form, built afresh from the complaint it edits (untracked: building writes signals). */
  protected readonly form = computed(() => {
    const c = this.complaint();
    return untracked(() =>
      this.fb.group({
        formulaId: c?.formulaId ?? '',
        batchId: c?.batchId ?? '',
        finishedLotCode: c?.finishedLotCode ?? '',
        receivedOn: c?.receivedOn ?? todayIso(),
        reporterName: c?.reporterName ?? '',
        reporterContact: c?.reporterContact ?? '',
        whatHappened: c?.whatHappened ?? '',
        bodyArea: c?.bodyArea ?? '',
        serious: c?.serious ?? false,
        status: c?.status ?? ('open' as 'open' | 'closed'),
        followUpNotes: c?.followUpNotes ?? '',
        reportedToFdaOn: c?.reportedToFdaOn ?? '',
      }),
    );
  });
  /** The chosen batch's code, for the closed picker ("Not known" when none). */
  protected batchCode(id: string | null): string {
    if (!id) return 'Not known';
    return this.batches.value()?.items.find((b) => b.id === id)?.batchCode ?? '';
  }

  /** The product chosen in the form, so the batch picker offers its batches only. */
  protected readonly chosenProduct = linkedSignal(() => this.complaint()?.formulaId ?? '');
  protected readonly batches = this.api.batchesOf(() => this.chosenProduct() || undefined);

  /** The US reporting clock in plain words, when the complaint has one. */
  protected readonly clockText = computed(() => {
    const clock = this.complaint()?.usReportingClock;
    return clock ? reportingDeadline(clock, this.locale) : '';
  });

  hasUnsavedChanges(): boolean {
    return this.form().dirty;
  }

  saveChanges(): Promise<boolean> {
    return this.submit();
  }

  /** Checks and saves the complaint; resolves whether it was saved. */
  async submit(): Promise<boolean> {
    if (this.sending()) return false;
    const form = this.form();
    const value = validateForm(form, complaintCreateSchema);
    if (!value) return false;
    const existing = this.complaint();
    const request = existing
      ? this.api.update(existing.id, value)
      : this.api.create(value, this.submission.for(value));
    const saved = await sendForm(form, request, { sending: this.sending, notice: this.notice });
    if (!saved) return false;
    this.submission.done();
    this.snackBar.open(existing ? 'The complaint is saved.' : 'The complaint is logged.', 'OK', {
      duration: 5000,
    });
    if (existing) this.resource.set(saved);
    else void this.router.navigate(['/complaints', saved.id], { replaceUrl: true });
    return true;
  }
}
