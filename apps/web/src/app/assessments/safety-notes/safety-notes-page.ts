import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  signal,
  untracked,
} from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatAnchor, MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import { type SafetyNotes, safetyNotesSchema } from '@batchproof/shared';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';
import { errorMessage, validateForm } from '../../forms/form-errors';
import { sendForm } from '../../forms/send-form';
import { type LeavesSafely, warnBeforeUnload } from '../../forms/unsaved-changes';
import { messageOf } from '../../http/api-error';
import { AssessmentsApi } from '../assessments-api';

/** The notes' fields with the Annex I Part A item each belongs to and a prompt. */
const FIELDS: readonly { key: keyof SafetyNotes; label: string; item: number; hint: string }[] = [
  {
    key: 'physicalChemical',
    label: 'Physical and chemical characteristics',
    item: 2,
    hint: 'Appearance, colour, odour, pH, density, viscosity…',
  },
  { key: 'stability', label: 'Stability', item: 2, hint: 'Tests run, conditions, results, dates' },
  {
    key: 'microbiological',
    label: 'Microbiological quality',
    item: 3,
    hint: 'Challenge test, water activity, preservation',
  },
  {
    key: 'impurities',
    label: 'Impurities and traces',
    item: 4,
    hint: 'Traces of prohibited substances and why they cannot be avoided',
  },
  {
    key: 'packaging',
    label: 'Packaging material',
    item: 4,
    hint: 'What touches the product and its relevant characteristics',
  },
  {
    key: 'normalUse',
    label: 'Normal and reasonably foreseeable use',
    item: 5,
    hint: 'Directions, who uses it, how often, foreseeable misuse',
  },
];

/**
 * The maker's safety notes of one formula version (`/assessments/notes/:formulaId/:n`): what
 * Annex I Part A items 2–5 ask that the formula itself does not say. They go into the packet the
 * assessor reads; owners and formulators write them until the version's assessment is signed.
 */
@Component({
  selector: 'bp-safety-notes-page',
  imports: [
    CalendarDayPipe,
    MatAnchor,
    MatButton,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatProgressBar,
    ReactiveFormsModule,
    RouterLink,
  ],
  template: `
    <nav class="crumbs" aria-label="Breadcrumb">
      <a [routerLink]="['/formulas', formulaId(), 'versions', n()]">Formula version {{ n() }}</a>
    </nav>
    <h1>Safety notes · version {{ n() }}</h1>
    <p class="lead">
      What you know about this version that the formula does not say. The safety assessor reads
      these notes in the packet under Annex I Part A items 2–5.
    </p>
    <div class="progress">
      @if (notes.isLoading() || sending()) {
        <mat-progress-bar mode="indeterminate" aria-label="Loading the safety notes" />
      }
    </div>
    @if (loadError()) {
      <p class="bp-form-error" role="alert">
        <mat-icon aria-hidden="true">error_outline</mat-icon>{{ loadError() }}
        <button mat-button type="button" (click)="notes.reload()">Try again</button>
      </p>
    }
    @if (record(); as r) {
      @if (r.updatedAt) {
        <p class="muted">
          Last changed <time [attr.datetime]="r.updatedAt">{{ r.updatedAt | day: 'time' }}</time>
          @if (r.updatedByName) {
            by {{ r.updatedByName }}
          }
        </p>
      }
    }
    @if (form(); as f) {
      @if (notice()) {
        <p class="bp-form-error" role="alert">
          <mat-icon aria-hidden="true">error_outline</mat-icon>{{ notice() }}
        </p>
      }
      <form
        class="bp-form"
        [formGroup]="f"
        (ngSubmit)="save()"
        novalidate
        aria-label="Safety notes"
      >
        @for (field of fields; track field.key) {
          <mat-form-field subscriptSizing="dynamic">
            <mat-label>{{ field.item }}. {{ field.label }}</mat-label>
            <textarea matInput [formControlName]="field.key" rows="3"></textarea>
            <mat-hint>{{ field.hint }}</mat-hint>
            <mat-error>{{ errorMessage(f.controls[field.key]) }}</mat-error>
          </mat-form-field>
        }
        <div class="actions">
          <button mat-flat-button type="submit" [disabled]="sending()">
            <mat-icon>save</mat-icon>
            Save safety notes
          </button>
        </div>
      </form>
    }
  `,
  styles: `
    :host {
      display: block;
      max-width: 48rem;
    }
    .crumbs {
      font: var(--mat-sys-body-medium);
    }
    h1 {
      margin: 4px 0;
      font: var(--mat-sys-headline-medium);
    }
    .lead,
    .muted {
      color: var(--mat-sys-on-surface-variant);
    }
    .progress {
      height: 4px;
      margin-bottom: 8px;
    }
    .actions {
      display: flex;
      justify-content: flex-end;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class SafetyNotesPage implements LeavesSafely {
  readonly formulaId = input.required<string>();
  readonly n = input.required<string>();

  private readonly api = inject(AssessmentsApi);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly fields = FIELDS;
  protected readonly errorMessage = errorMessage;
  protected readonly sending = signal(false);
  protected readonly notice = signal('');

  protected readonly notes = this.api.safetyNotes(() => {
    const n = Number(this.n());
    return Number.isInteger(n) && n > 0 ? { formulaId: this.formulaId(), n } : undefined;
  });
  protected readonly record = computed(() =>
    this.notes.hasValue() ? this.notes.value() : undefined,
  );
  protected readonly loadError = computed(() => {
    const error = this.notes.error();
    return error ? messageOf(error) : '';
  });
  /** The form, built once per version read (a save keeps it). */
  private readonly versionId = computed(() => this.record()?.versionId);
  protected readonly form = computed(() => {
    if (!this.versionId()) return undefined;
    const notes = untracked(() => this.record()!.notes);
    return untracked(() => this.fb.group({ ...notes }));
  });

  constructor() {
    warnBeforeUnload(() => this.hasUnsavedChanges());
  }

  hasUnsavedChanges(): boolean {
    return !!this.form()?.dirty;
  }

  saveChanges(): Promise<boolean> {
    return this.save();
  }

  async save(): Promise<boolean> {
    const f = this.form();
    if (!f || this.sending()) return false;
    const value = validateForm(f, safetyNotesSchema);
    if (!value) return false;
    const saved = await sendForm(
      f,
      this.api.saveSafetyNotes(this.formulaId(), Number(this.n()), value),
      { sending: this.sending, notice: this.notice },
    );
    if (!saved) return false;
    this.notes.set(saved);
    this.snackBar.open('The safety notes are saved.', 'OK', { duration: 5000 });
    return true;
  }
}
