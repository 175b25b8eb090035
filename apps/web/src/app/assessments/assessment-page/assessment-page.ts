import { DecimalPipe, NgTemplateOutlet } from '@angular/common';
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
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatAnchor, MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOptgroup, MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import {
  type AssessmentDetail,
  formatMargin,
  assessmentUpdateSchema,
  type PacketCompositionLine,
  PART_A_HEADINGS,
  PART_B_HEADINGS,
  ROLE_SETS,
} from '@batchproof/shared';
import { Session } from '../../auth/session';
import { browserLocale } from '../../dates/calendar-day-adapter';
import { CalendarDayPipe, formatDay } from '../../dates/calendar-day-pipe';
import { saveFile } from '../../documents/save-file';
import { checkForm, errorMessage, showRequestError } from '../../forms/form-errors';
import { formValue } from '../../forms/form-value';
import { sendForm } from '../../forms/send-form';
import { type LeavesSafely, warnBeforeUnload } from '../../forms/unsaved-changes';
import { ApiError, messageOf } from '../../http/api-error';
import { fileSafe } from '../../labels/calibration-download';
import { AssessmentsApi } from '../assessments-api';
import {
  assessmentPath,
  createAssessmentForm,
  exposureOptions,
  liveExposure,
  liveMargins,
  OWN_VALUES,
  presetOf,
  updateBody,
} from './assessment-form';
import { PacketInformation } from './packet-information';
import { SignDialog, type SignDialogData } from './sign-dialog';

/** What the page says when signing was refused because the packet changed meanwhile. */
export const PACKET_CHANGED_NOTICE =
  'The packet changed since you opened it (the formula version, its materials, documents or the maker’s notes were updated), so it was not signed. It has been reloaded: read it again, then sign.';

/**
 * One safety assessment (`/assessments/:id`): the packet under the headings of Annex I Part A of
 * Regulation (EC) No 1223/2009, the assessor's exposure, absorption and points of departure with
 * the margins of safety they give, Part B, and signing over the packet's SHA-256. Only the
 * assessor of a draft edits; everyone else, and everyone once it is signed, reads.
 */
@Component({
  selector: 'bp-assessment-page',
  imports: [
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
    MatOptgroup,
    MatOption,
    MatProgressBar,
    MatSelect,
    MatSuffix,
    NgTemplateOutlet,
    PacketInformation,
    ReactiveFormsModule,
    RouterLink,
  ],
  templateUrl: './assessment-page.html',
  styleUrl: './assessment-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class AssessmentPage implements LeavesSafely {
  /** The assessment's id, from the path. */
  readonly id = input.required<string>();

  private readonly api = inject(AssessmentsApi);
  private readonly session = inject(Session);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly fb = inject(NonNullableFormBuilder);
  /** Dates read in the browser's language, as the day pipe shows them. */
  private readonly locale = browserLocale();

  protected readonly partA = PART_A_HEADINGS;
  protected readonly partB = PART_B_HEADINGS;
  protected readonly errorMessage = errorMessage;
  protected readonly marginText = formatMargin;
  protected readonly ownValues = OWN_VALUES;
  protected readonly partBFields = [
    'conclusion',
    'labelWarnings',
    'reasoning',
    'credentials',
  ] as const;

  protected readonly resource = this.api.assessment(() => this.id());
  protected readonly detail = computed<AssessmentDetail | undefined>(() =>
    this.resource.hasValue() ? this.resource.value() : undefined,
  );
  protected readonly packet = computed(() => this.detail()?.packet);
  protected readonly loadError = computed(() => {
    const error = this.resource.error();
    return error ? messageOf(error) : '';
  });
  protected readonly canEdit = computed(() => !!this.detail()?.canEdit);
  protected readonly signed = computed(() => this.detail()?.status === 'signed');
  /** Writers edit the maker's notes (items 2–5) while the assessment is not signed. */
  protected readonly canEditNotes = computed(
    () => this.session.hasRole(ROLE_SETS.writers) && !this.signed(),
  );

  /** The form, built once per assessment and set of substances (untracked: building writes signals). */
  private readonly basis = computed(() => this.detail(), {
    equal: (a, b) =>
      a?.id === b?.id &&
      a?.packet.substances.map((s) => s.key).join('\n') ===
        b?.packet.substances.map((s) => s.key).join('\n'),
  });
  protected readonly form = computed(() => {
    const d = this.basis();
    return d ? untracked(() => createAssessmentForm(this.fb, d)) : undefined;
  });
  /** What the form holds, following every change. */
  protected readonly value = formValue(this.form);

  protected readonly options = computed(() => {
    const d = this.detail();
    return d ? exposureOptions(d) : { forType: [], others: [] };
  });
  protected readonly choice = computed(() => this.value()?.exposure.choice ?? '');
  protected readonly chosenPreset = computed(() => presetOf(this.choice()));
  /** A as it stands: live while editing, the saved packet's otherwise. */
  protected readonly exposureA = computed(() => {
    const d = this.detail();
    const v = this.value();
    if (!d) return null;
    if (d.canEdit && v) return liveExposure(v, d);
    return d.packet.exposure?.exposureMgPerKgDay ?? null;
  });
  /** The margins shown: worked out from what is typed while editing, the packet's otherwise. */
  protected readonly margins = computed(() => {
    const d = this.detail();
    const v = this.value();
    if (!d) return [];
    if (d.canEdit && v) return liveMargins(v, d.packet.substances, this.exposureA());
    return d.packet.margins;
  });
  protected readonly flaggedCount = computed(() => this.margins().filter((m) => m.flagged).length);

  protected readonly sending = signal(false);
  protected readonly notice = signal('');
  protected readonly downloading = signal(false);

  constructor() {
    // Only the assessor of a draft changes anything; a signed assessment is locked for everyone.
    effect(() => {
      const f = this.form();
      if (!f) return;
      if (this.canEdit()) f.enable();
      else f.disable();
    });
    warnBeforeUnload(() => this.hasUnsavedChanges());
  }

  hasUnsavedChanges(): boolean {
    return this.canEdit() && !!this.form()?.dirty;
  }

  saveChanges(): Promise<boolean> {
    return this.save();
  }

  /** Checks the draft against the contract and saves it; resolves whether it was saved. */
  async save(): Promise<boolean> {
    const f = this.form();
    const d = this.detail();
    if (!f || !d || this.sending()) return false;
    const body = updateBody(f.getRawValue(), d);
    const { value, notice } = checkForm(f, {
      schema: assessmentUpdateSchema,
      body,
      mapPath: assessmentPath,
    });
    if (!value) {
      this.notice.set(notice || 'Some values are refused: see the messages beside them.');
      return false;
    }
    const saved = await sendForm(
      f,
      this.api.update(d.id, value),
      { sending: this.sending, notice: this.notice },
      assessmentPath,
    );
    if (!saved) return false;
    this.resource.set(saved);
    this.snackBar.open('The assessment is saved.', 'OK', { duration: 5000 });
    return true;
  }

  /** A fragrance's supplier and certificate in one line (Annex I Part A item 1). */
  protected fragranceText(fr: NonNullable<PacketCompositionLine['fragrance']>): string {
    const from = `Fragrance from ${fr.supplierName ?? 'an unnamed supplier'}${fr.code ? ` (${fr.code})` : ''}`;
    const cert = fr.certificate;
    if (!cert) return `${from} · no certificate on file`;
    const issued = cert.issuedOn ? `, issued ${formatDay(cert.issuedOn, this.locale)}` : '';
    return `${from} · certificate: ${cert.title}${issued}`;
  }

  /** Saves what is typed, then asks the assessor to sign over the packet's hash. */
  async sign(): Promise<void> {
    if (this.form()?.dirty && !(await this.save())) return;
    const d = this.detail();
    if (!d) return;
    const data: SignDialogData = {
      productName: d.packet.formula.name,
      versionNumber: d.versionNumber,
      signerName: this.session.user()?.name ?? d.packet.assessment.assessorName,
      contentHash: d.contentHash,
    };
    const yes = await firstValueFrom(
      this.dialog
        .open<SignDialog, SignDialogData, boolean>(SignDialog, { data, width: '34rem' })
        .afterClosed(),
    );
    if (!yes) return;
    this.sending.set(true);
    this.notice.set('');
    try {
      const signed = await firstValueFrom(
        this.api.sign(d.id, { contentHash: d.contentHash, confirm: true }),
      );
      this.resource.set(signed);
      this.form()?.markAsPristine();
      this.snackBar.open('The assessment is signed.', 'OK', { duration: 5000 });
    } catch (err: unknown) {
      if (err instanceof ApiError && err.code === 'packet_changed') {
        this.notice.set(PACKET_CHANGED_NOTICE);
        this.resource.reload();
      } else {
        const f = this.form();
        this.notice.set(f ? showRequestError(f, err, assessmentPath) : messageOf(err));
      }
    } finally {
      this.sending.set(false);
    }
  }

  /** The packet as a PDF: the signed packet, or the live draft marked as not signed. */
  protected downloadPdf(): void {
    const d = this.detail();
    if (!d) return;
    this.downloading.set(true);
    this.api.packetPdf(d.id).subscribe({
      next: (pdf) => {
        this.downloading.set(false);
        const state = d.status === 'signed' ? 'signed' : 'draft';
        saveFile(
          pdf,
          `safety-packet-${fileSafe(d.packet.formula.name)}-v${d.versionNumber}-${state}.pdf`,
        );
      },
      error: (err: unknown) => {
        this.downloading.set(false);
        this.snackBar.open(messageOf(err), 'OK', { duration: 8000 });
      },
    });
  }
}
