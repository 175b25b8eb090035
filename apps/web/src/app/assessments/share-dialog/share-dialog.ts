import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogRef,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatRadioButton, MatRadioGroup } from '@angular/material/radio';
import { RouterLink } from '@angular/router';
import type { ShareRecord } from '@batchproof/shared';
import { ApiError, messageOf } from '../../http/api-error';
import { SubmissionKey } from '../../http/submission-key';
import { AssessmentsApi } from '../assessments-api';

/** The version to share. */
export interface ShareDialogData {
  versionId: string;
  formulaName: string;
  versionNumber: number;
}

/**
 * The owner shares one formula version with an assessor member of the workshop: they see that
 * version's packet, read-only, and write their assessment of it. Closes with the share, or
 * undefined when nothing was shared.
 */
@Component({
  selector: 'bp-share-dialog',
  imports: [
    MatButton,
    MatDialogActions,
    MatDialogClose,
    MatDialogContent,
    MatDialogTitle,
    MatIcon,
    MatProgressBar,
    MatRadioButton,
    MatRadioGroup,
    RouterLink,
  ],
  template: `
    <h2 mat-dialog-title>Share with an assessor</h2>
    <mat-dialog-content>
      <p>
        {{ data.formulaName }}, version {{ data.versionNumber }}: the assessor sees this version's
        safety packet, read-only, and writes and signs their assessment of it. Nothing else of the
        workshop is shown to them.
      </p>
      <div class="progress">
        @if (assessors.isLoading() || sending()) {
          <mat-progress-bar mode="indeterminate" aria-label="Loading the assessors" />
        }
      </div>
      @if (loadError()) {
        <p class="bp-form-error" role="alert">{{ loadError() }}</p>
      } @else if (assessors.hasValue() && list().length === 0) {
        <p class="none" data-testid="no-assessor">
          <mat-icon aria-hidden="true">person_search</mat-icon>
          <span>
            No member of this workshop has the assessor role yet. Invite your safety assessor on the
            <a routerLink="/workshop" mat-dialog-close>Workshop page</a> (role: assessor), then
            share again.
          </span>
        </p>
      } @else if (list().length > 0) {
        <mat-radio-group
          class="choices"
          aria-label="Assessor"
          [value]="chosen()"
          (change)="chosen.set($event.value)"
        >
          @for (m of list(); track m.id) {
            <mat-radio-button [value]="m.id">
              {{ m.name }} <span class="email">{{ m.email }}</span>
            </mat-radio-button>
          }
        </mat-radio-group>
      }
      @if (notice()) {
        <p class="bp-form-error" role="alert">{{ notice() }}</p>
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close>Cancel</button>
      @if (list().length > 0) {
        <button mat-flat-button type="button" [disabled]="!chosen() || sending()" (click)="share()">
          <mat-icon>share</mat-icon>
          Share
        </button>
      }
    </mat-dialog-actions>
  `,
  styles: `
    .progress {
      height: 4px;
    }
    .choices {
      display: flex;
      flex-direction: column;
      gap: 4px;
    }
    .email {
      color: var(--mat-sys-on-surface-variant);
      overflow-wrap: anywhere;
    }
    .none {
      display: flex;
      gap: 8px;
      align-items: flex-start;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ShareDialog {
  protected readonly data = inject<ShareDialogData>(MAT_DIALOG_DATA);
  private readonly ref = inject<MatDialogRef<ShareDialog, ShareRecord>>(MatDialogRef);
  private readonly api = inject(AssessmentsApi);
  private readonly submission = new SubmissionKey();

  protected readonly assessors = this.api.assessors(() => true);
  protected readonly list = computed(() =>
    this.assessors.hasValue() ? this.assessors.value() : [],
  );
  protected readonly loadError = computed(() => {
    const error = this.assessors.error();
    return error ? messageOf(error) : '';
  });
  protected readonly chosen = signal<string | null>(null);
  protected readonly sending = signal(false);
  protected readonly notice = signal('');

  protected share(): void {
    const assessorId = this.chosen();
    if (!assessorId) return;
    const body = { versionId: this.data.versionId, assessorId };
    this.sending.set(true);
    this.notice.set('');
    this.api.share(body.versionId, assessorId, this.submission.for(body)).subscribe({
      next: (share) => {
        this.sending.set(false);
        this.submission.done();
        this.ref.close(share);
      },
      error: (err: unknown) => {
        this.sending.set(false);
        // Field messages (a version still a draft, someone no longer an assessor) read as one notice.
        const fields = err instanceof ApiError ? Object.values(err.fieldErrors).flat() : [];
        this.notice.set([messageOf(err), ...fields].join(' '));
      },
    });
  }
}
