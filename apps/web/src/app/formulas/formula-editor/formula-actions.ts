import type { HttpResourceRef } from '@angular/common/http';
import { computed, inject, type Signal, signal } from '@angular/core';
import { MatDialog } from '@angular/material/dialog';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router } from '@angular/router';
import { type Observable, of, switchMap } from 'rxjs';
import {
  type ComplianceFinding,
  type Formula,
  formulaUpdateSchema,
  type FormulaVersion,
  formulaVersionInputSchema,
} from '@batchproof/shared';
import { checkForm, showRequestError } from '../../forms/form-errors';
import { ApiError, messageOf } from '../../http/api-error';
import { SubmissionKey } from '../../http/submission-key';
import { FormulasApi } from '../formulas-api';
import { editorPath, type FormulaForm, toVersionInput } from './formula-form';
import { ReleaseDialog, type ReleaseOverrideData } from './release-dialog';

/** The page state the actions work on. */
export interface FormulaActionsSource {
  formulaId: Signal<string>;
  form: Signal<FormulaForm | undefined>;
  formula: HttpResourceRef<Formula | undefined>;
  /** The version on screen: its value is always the server's latest answer about it. */
  version: HttpResourceRef<FormulaVersion | undefined>;
  isOwner: Signal<boolean>;
}

/** Why the server refuses to release the version, and whether the owner may override it. */
export interface Refusal {
  message: string;
  /** Whether it is refused for blocking findings (rather than, say, an unchecked draft). */
  blocked: boolean;
  /** The blocking findings of the server's latest check. */
  findings: ComplianceFinding[];
}

/** A 409 to a release, with the version answer that was on screen when it came. */
interface RefusalAnswer extends Refusal {
  number: number;
  /** The version answer the refusal is newer than; any later answer supersedes the refusal. */
  after: FormulaVersion;
}

const SNACK = { duration: 5000 };

/** A resource's value, or undefined while it has none (reading an errored resource throws). */
const valueOf = <T>(ref: HttpResourceRef<T | undefined>) =>
  ref.hasValue() ? ref.value() : undefined;

/**
 * Whether the server's stored check of a draft refuses its release, in its own words: a version
 * that could not be checked, or one with blocking findings. Null when a release would go ahead.
 */
export function refusalOf(version: FormulaVersion): Refusal | null {
  if (version.state !== 'draft') return null;
  if (!version.evaluation && version.evaluationProblems.length > 0) {
    const problems = version.evaluationProblems.join('; ');
    return {
      message: `Version ${version.number} cannot be checked yet: ${problems}`,
      blocked: false,
      findings: [],
    };
  }
  const findings = version.evaluation?.findings.filter((f) => f.severity === 'block') ?? [];
  const count = version.counts?.block ?? findings.length;
  if (count === 0) return null;
  const list = findings.map((f) => `${f.market ?? 'all markets'}: ${f.subject}`).join('; ');
  return {
    message:
      `The server's latest check of version ${version.number} found ${count} blocking ` +
      `finding(s)${list ? ` (${list})` : ''}.`,
    blocked: true,
    findings,
  };
}

/**
 * What the editor's buttons do: save the draft (the server re-evaluates it), release it (the
 * server refuses blocking findings unless the owner overrides with a reason) and start a new
 * draft from a released version. Built in the page's field initialisers, so it may inject.
 */
export class FormulaActions {
  private readonly api = inject(FormulasApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly router = inject(Router);

  /** What is on its way to the server, for the progress bar; null when nothing is. */
  readonly busy = signal<string | null>(null);
  /** A message for above the form (what no field shows). */
  readonly notice = signal('');
  /** The last 409 to a release of the version on screen. */
  private readonly refused = signal<RefusalAnswer | null>(null);
  /**
   * The refusal banner, derived from the newest server answer about the version: the 409 itself
   * until the version is read or saved again, then that answer's own check. A save that clears
   * the blocks clears the banner with them; one that leaves some updates their count.
   */
  readonly refusal = computed<Refusal | null>(() => {
    const refused = this.refused();
    const version = valueOf(this.source.version);
    if (!refused || !version || version.number !== refused.number) return null;
    if (version === refused.after) return refused;
    const now = refusalOf(version);
    // An answer that counts blocks without listing them leaves the refusal's list as the latest.
    return now?.blocked && now.findings.length === 0 ? { ...now, findings: refused.findings } : now;
  });
  /** The Idempotency-Key of a new-draft request, kept while it is retried. */
  private readonly draftSubmission = new SubmissionKey();

  constructor(private readonly source: FormulaActionsSource) {}

  /**
   * Saves the draft: checks it with the shared schemas first, renames the formula if its name or
   * type changed, then replaces the version. On a 400 the messages go beside their fields and
   * everything typed stays as it is. Resolves whether it was saved.
   */
  save(): Promise<boolean> {
    const form = this.source.form();
    const formula = valueOf(this.source.formula);
    const version = valueOf(this.source.version);
    if (!form || !formula || !version || this.busy()) return Promise.resolve(false);
    this.notice.set('');
    const raw = form.getRawValue();
    const meta = checkForm(form, {
      schema: formulaUpdateSchema,
      body: { name: raw.name, productType: raw.productType, notes: formula.notes },
    });
    const body = checkForm(form, {
      schema: formulaVersionInputSchema,
      body: toVersionInput(raw),
      mapPath: editorPath,
    });
    if (!meta.value || !body.value) {
      this.notice.set(
        [meta.notice, body.notice].filter(Boolean).join(' ') ||
          'Some fields need attention before the draft can be saved.',
      );
      return Promise.resolve(false);
    }
    const renamed = raw.name !== formula.name || raw.productType !== formula.productType;
    const id = formula.id;
    const rename: Observable<unknown> = renamed ? this.api.update(id, meta.value) : of(null);
    this.busy.set('Saving the draft');
    return new Promise((resolve) => {
      rename.pipe(switchMap(() => this.api.saveDraft(id, version.number, body.value!))).subscribe({
        next: (saved) => {
          this.busy.set(null);
          this.source.version.set(saved);
          form.markAsPristine();
          if (renamed) this.source.formula.reload();
          const blocks = saved.counts?.block ?? 0;
          this.snackBar.open(
            `Draft version ${saved.number} saved.` +
              (blocks > 0 ? ` The server's check found ${blocks} blocking finding(s).` : ''),
            'OK',
            SNACK,
          );
          resolve(true);
        },
        error: (err: unknown) => {
          this.busy.set(null);
          this.notice.set(showRequestError(form, err, editorPath));
          resolve(false);
        },
      });
    });
  }

  /** Releases the draft, saving unsaved changes first. */
  release(): void {
    const form = this.source.form();
    if (!form || this.busy()) return;
    this.refused.set(null);
    if (form.dirty) {
      void this.save().then((saved) => {
        if (saved) this.sendRelease();
      });
    } else {
      this.sendRelease();
    }
  }

  /** The owner's release over blocking findings, with a reason asked for in a dialog. */
  releaseWithReason(): void {
    const version = valueOf(this.source.version);
    const refusal = this.refusal();
    if (!version || !refusal || !this.source.isOwner()) return;
    const data: ReleaseOverrideData = {
      version: version.number,
      refusal: refusal.message,
      blocking: refusal.findings,
    };
    this.dialog
      .open<ReleaseDialog, ReleaseOverrideData, string>(ReleaseDialog, { data, width: '36rem' })
      .afterClosed()
      .subscribe((reason) => {
        if (reason) this.sendRelease(reason);
      });
  }

  /** Starts a new draft copied from the version on screen and opens it. */
  newDraft(): void {
    const version = valueOf(this.source.version);
    if (!version || this.busy()) return;
    const id = this.source.formulaId();
    this.busy.set('Starting a new draft');
    const key = this.draftSubmission.for({ id, fromVersion: version.number });
    this.api.newDraft(id, version.number, key).subscribe({
      next: (draft) => {
        this.busy.set(null);
        this.draftSubmission.done();
        this.source.formula.reload();
        this.snackBar.open(
          `Draft version ${draft.number} started from version ${version.number}.`,
          'OK',
          SNACK,
        );
        void this.router.navigate(['/formulas', id, 'versions', draft.number]);
      },
      error: (err: unknown) => {
        this.busy.set(null);
        this.snackBar.open(messageOf(err), 'OK', { duration: 8000 });
      },
    });
  }

  private sendRelease(reason?: string): void {
    const version = valueOf(this.source.version);
    if (!version) return;
    const id = this.source.formulaId();
    this.busy.set('Releasing');
    const request = reason ? { override: { reason } } : {};
    this.api.release(id, version.number, request).subscribe({
      next: (released) => {
        this.busy.set(null);
        this.refused.set(null);
        this.source.version.set(released);
        this.source.formula.reload();
        this.snackBar.open(
          `Version ${released.number} released` +
            (released.overrideReason ? ' over its blocks; your reason is recorded.' : '.'),
          'OK',
          SNACK,
        );
      },
      error: (err: unknown) => {
        this.busy.set(null);
        if (err instanceof ApiError && err.status === 409) {
          this.refused.set({
            number: version.number,
            after: version,
            message: err.message,
            blocked: err.code === 'release_blocked',
            findings: err.findings,
          });
          // The server stored its fresh check even though it refused: that answer comes next.
          this.source.version.reload();
        } else {
          this.snackBar.open(messageOf(err), 'OK', { duration: 8000 });
        }
      },
    });
  }
}
