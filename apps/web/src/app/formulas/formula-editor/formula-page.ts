import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  linkedSignal,
} from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatAnchor, MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatDialog } from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import { map, of, startWith, switchMap } from 'rxjs';
import { type Material, ROLE_SETS, todayIso } from '@batchproof/shared';
import { Session } from '../../auth/session';
import { checkWhileTyping, errorMessage, filledInErrors } from '../../forms/form-errors';
import { type LeavesSafely, warnBeforeUnload } from '../../forms/unsaved-changes';
import { messageOf } from '../../http/api-error';
import { MaterialsApi } from '../../materials/materials-api';
import { FormulasApi } from '../formulas-api';
import { AssessmentFindings } from '../live-checks/assessment-findings';
import { LiveChecks } from '../live-checks/live-checks';
import { evaluateDraft, type LiveEvaluation } from '../live-checks/live-evaluation';
import { ScalePanel } from '../scaling/scale-panel';
import { SEVERITIES, SeverityLabel } from '../severity/severity-label';
import { FormulaActions } from './formula-actions';
import { FormulaHousekeeping } from './formula-housekeeping';
import { createFormulaForm, draftErrors, editorPath } from './formula-form';
import { FormulaLines } from './formula-lines';
import { ProfileFields } from './profile-fields';
import { VersionHistory } from './version-history';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';
import { FormulaLabelRuns } from '../../labels/formula-label-runs';

const sameIds = (a: readonly string[], b: readonly string[]) => a.join() === b.join();

/** The live check while a typed value is refused: nothing is computed with it. */
const HELD_BACK: LiveEvaluation = {
  result: null,
  problems: ['A value in the form is refused (see the message beside it); put it right to check.'],
  pending: false,
  fizz: null,
  composition: [],
  totalGrams: 0,
};

/**
 * A formula version in the editor: the version on the left (profile, lines, notes), its live
 * consequences on the right, computed in the browser by the shared engine as you type. Drafts are
 * saved and released here; released versions are read-only and start new drafts. What the
 * server says about the version (its state, its check, a refused release) is read from one
 * answer, the version resource's latest value, by every part of the page.
 */
@Component({
  selector: 'bp-formula-page',
  imports: [
    AssessmentFindings,
    FormulaHousekeeping,
    FormulaLabelRuns,
    CalendarDayPipe,
    ReactiveFormsModule,
    MatAnchor,
    MatButton,
    MatError,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
    MatProgressBar,
    RouterLink,
    FormulaLines,
    LiveChecks,
    ProfileFields,
    ScalePanel,
    SeverityLabel,
    VersionHistory,
  ],
  templateUrl: './formula-page.html',
  styleUrl: './formula-page.scss',
  host: { '(keydown.control.s)': 'saveShortcut($event)' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class FormulaPage implements LeavesSafely {
  /** The formula's id, from the path. */
  readonly id = input.required<string>();
  /** The version number from the path; the latest version when absent. */
  readonly n = input<string>();

  private readonly api = inject(FormulasApi);
  private readonly session = inject(Session);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly errorMessage = errorMessage;
  protected readonly severities = SEVERITIES;
  /** The shared calendar day the server also checks against when saving. */
  private readonly asOf = todayIso();

  /** Whether the signed-in member may change formulas. */
  protected readonly canWrite = computed(() => this.session.hasRole(ROLE_SETS.writers));
  protected readonly isOwner = computed(() => this.session.hasRole(ROLE_SETS.ownerOnly));

  protected readonly formula = this.api.formula(() => this.id());
  /** The version on screen: the one in the path, else the latest. */
  protected readonly number = computed(() => {
    const n = Number(this.n());
    if (Number.isInteger(n) && n > 0) return n;
    const f = this.formula.hasValue() ? this.formula.value() : undefined;
    return f?.versions.length ? Math.max(...f.versions.map((v) => v.number)) : undefined;
  });
  protected readonly version = this.api.version(() => {
    const n = this.number();
    return n ? { id: this.id(), n } : undefined;
  });
  protected readonly loadError = computed(() => {
    const error = this.formula.error() ?? this.version.error();
    return error ? messageOf(error) : '';
  });

  /** The formula and version the form was built from; a save of the same version keeps it. */
  private readonly loaded = computed(
    () =>
      this.formula.hasValue() && this.version.hasValue()
        ? { formula: this.formula.value(), version: this.version.value() }
        : undefined,
    { equal: (a, b) => a?.version.id === b?.version.id },
  );
  /** The editor's form, built once per version shown. */
  protected readonly form = computed(() => {
    const l = this.loaded();
    return l ? createFormulaForm(this.fb, l.formula, l.version) : undefined;
  });
  /** Whether the version on screen can change: a draft, and a member who writes. */
  protected readonly readOnly = computed(
    () => !this.canWrite() || !this.version.hasValue() || this.version.value().state !== 'draft',
  );
  /** Everything typed, with a revision that moves on every value, status or touch change. */
  protected readonly state = toSignal(
    toObservable(this.form).pipe(
      switchMap((f) =>
        f
          ? f.events.pipe(
              startWith(null),
              map((_, revision) => ({ value: f.getRawValue(), revision, dirty: f.dirty })),
            )
          : of(undefined),
      ),
    ),
  );

  private readonly materialIds = computed(
    () =>
      // Substitutes too: the live check runs the engine with each in its line's place.
      [
        ...new Set(
          (this.state()?.value.lines ?? []).flatMap((l) => [
            l.materialId,
            ...l.substitutes.map((s) => s.materialId),
          ]),
        ),
      ]
        .filter(Boolean)
        .sort(),
    { equal: sameIds },
  );
  private readonly materials = inject(MaterialsApi).materials(this.materialIds);
  /** The lines' full materials; the last set stays while another line's material loads. */
  private readonly materialMap = linkedSignal<
    ReadonlyMap<string, Material> | undefined,
    ReadonlyMap<string, Material>
  >({
    source: () => (this.materials.hasValue() ? this.materials.value() : undefined),
    computation: (value, previous) => value ?? previous?.value ?? new Map(),
  });
  protected readonly materialsError = computed(() => {
    const error = this.materials.error();
    return error ? `Some materials could not be loaded: ${messageOf(error)}` : '';
  });
  /** The contract's messages for the fields that hold something (shown beside them as typed). */
  private readonly refusedFields = computed(() => {
    const s = this.state();
    const f = this.form();
    return s && f ? filledInErrors(f, draftErrors(s.value), editorPath) : {};
  });
  /** The live check of what is typed now; held back while a typed value is refused. */
  protected readonly live = computed((): LiveEvaluation | undefined => {
    const s = this.state();
    if (!s) return undefined;
    if (Object.keys(this.refusedFields()).length > 0) return HELD_BACK;
    const live = evaluateDraft(s.value, this.materialMap(), this.asOf);
    return this.materials.isLoading() ? { ...live, pending: true } : live;
  });
  protected readonly actions = new FormulaActions({
    formulaId: this.id,
    form: this.form,
    formula: this.formula,
    version: this.version,
    isOwner: this.isOwner,
  });

  constructor() {
    // Released versions, and members who only read, see the form without being able to change it.
    effect(() => {
      const f = this.form();
      if (!f) return;
      if (this.readOnly()) f.disable();
      else f.enable();
    });
    // The contract judges every value as it is typed, so its reason shows beside the field.
    effect((onCleanup) => {
      const f = this.form();
      if (!f) return;
      const typing = checkWhileTyping(f, () => draftErrors(f.getRawValue()), editorPath);
      onCleanup(() => typing.unsubscribe());
    });
    warnBeforeUnload(() => this.hasUnsavedChanges());
  }

  /** Whether the draft on screen holds changes not saved yet. */
  hasUnsavedChanges(): boolean {
    return !this.readOnly() && !!this.form()?.dirty;
  }

  /** Saves the draft on the way out of the editor. */
  saveChanges(): Promise<boolean> {
    return this.actions.save();
  }

  /** The owner shares the version on screen with an assessor member (the dialog loads lazily). */
  protected async shareWithAssessor(): Promise<void> {
    const v = this.version.hasValue() ? this.version.value() : undefined;
    const name = this.formula.hasValue() ? this.formula.value().name : '';
    if (!v) return;
    const { ShareDialog } = await import('../../assessments/share-dialog/share-dialog');
    this.dialog
      .open(ShareDialog, {
        data: { versionId: v.id, formulaName: name, versionNumber: v.number },
        width: '32rem',
      })
      .afterClosed()
      .subscribe((share) => {
        if (share)
          this.snackBar.open(`Version ${v.number} is shared with ${share.assessorName}.`, 'OK', {
            duration: 5000,
          });
      });
  }

  protected saveShortcut(event: Event): void {
    event.preventDefault();
    if (!this.readOnly()) void this.actions.save();
  }
}
