import type { HttpResourceRef } from '@angular/common/http';
import { inject, type Signal, signal } from '@angular/core';
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
import { ApiError, messageOf } from '../../http/api-error';
import { SubmissionKey } from '../../http/submission-key';
import { showContractRequestError, validateContract } from '../form-paths';
import { FormulasApi } from '../formulas-api';
import { editorPath, type FormulaForm, toVersionInput } from './formula-form';
import { ReleaseDialog, type ReleaseOverrideData } from './release-dialog';

/** The page state the actions work on. */
export interface FormulaActionsSource {
  formulaId: Signal<string>;
  form: Signal<FormulaForm | undefined>;
  formula: HttpResourceRef<Formula | undefined>;
  version: HttpResourceRef<FormulaVersion | undefined>;
  isOwner: Signal<boolean>;
}

/** Why the server refused a release, and whether the owner may override it. */
export interface Refusal {
  message: string;
  /** Whether it was refused for blocking findings (rather than, say, an unchecked draft). */
  blocked: boolean;
  /** The blocking findings of the server's fresh check, as the refusal carried them. */
  findings: ComplianceFinding[];
}

const SNACK = { duration: 5000 };

/** A resource's value, or undefined while it has none (reading an errored resource throws). */
const valueOf = <T>(ref: HttpResourceRef<T | undefined>) =>
  ref.hasValue() ? ref.value() : undefined;

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
  /** The last release refusal, until the next attempt. */
  readonly refusal = signal<Refusal | null>(null);
  /** The Idempotency-Key of a new-draft request, kept while it is retried. */
  private readonly draftSubmission = new SubmissionKey();

  constructor(private readonly source: FormulaActionsSource) {}

  /**
   * Saves the draft: checks it with the shared schemas first, renames the formula if its name or
   * type changed, then replaces the version. On a 400 the messages go beside their fields and
   * everything typed stays as it is.
   */
  save(then?: () => void): void {
    const form = this.source.form();
    const formula = valueOf(this.source.formula);
    const version = valueOf(this.source.version);
    if (!form || !formula || !version || this.busy()) return;
    this.notice.set('');
    const raw = form.getRawValue();
    const meta = validateContract(
      form,
      formulaUpdateSchema,
      { name: raw.name, productType: raw.productType, notes: formula.notes },
      (p) => p,
    );
    const body = validateContract(form, formulaVersionInputSchema, toVersionInput(raw), editorPath);
    if (!meta.value || !body.value) {
      this.notice.set(
        [meta.notice, body.notice].filter(Boolean).join(' ') ||
          'Some fields need attention before the draft can be saved.',
      );
      return;
    }
    const renamed = raw.name !== formula.name || raw.productType !== formula.productType;
    const id = formula.id;
    const rename: Observable<unknown> = renamed ? this.api.update(id, meta.value) : of(null);
    this.busy.set('Saving the draft');
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
        then?.();
      },
      error: (err: unknown) => {
        this.busy.set(null);
        this.notice.set(showContractRequestError(form, err, editorPath));
      },
    });
  }

  /** Releases the draft, saving unsaved changes first. */
  release(): void {
    const form = this.source.form();
    if (!form || this.busy()) return;
    this.refusal.set(null);
    if (form.dirty) this.save(() => this.sendRelease());
    else this.sendRelease();
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
        this.refusal.set(null);
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
          const blocked = err.code === 'release_blocked';
          this.refusal.set({ message: err.message, blocked, findings: err.findings });
          // The server stored its fresh check even though it refused: show that one.
          this.source.version.reload();
        } else {
          this.snackBar.open(messageOf(err), 'OK', { duration: 8000 });
        }
      },
    });
  }
}
