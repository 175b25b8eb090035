import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormField, MatLabel, MatPrefix } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSort, MatSortHeader, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { Router, RouterLink } from '@angular/router';
import {
  type AssessmentStatus,
  type AssessmentSummary,
  ROLE_SETS,
  type ShareRecord,
} from '@batchproof/shared';
import { Session } from '../../auth/session';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';
import { messageOf } from '../../http/api-error';
import { SubmissionKey } from '../../http/submission-key';
import { ListCard } from '../../lists/list-card';
import { AssessmentsApi } from '../assessments-api';
import { confirmFirst } from '../../forms/confirm-dialog';

type SortKey = 'formulaName' | 'versionNumber' | 'status' | 'assessorName' | 'signedAt';

/** How each sortable column orders its rows (missing dates last when ascending). */
const SORT_VALUE: Record<SortKey, (a: AssessmentSummary) => string | number> = {
  formulaName: (a) => a.formulaName.toLocaleLowerCase(),
  versionNumber: (a) => a.versionNumber,
  status: (a) => a.status,
  assessorName: (a) => a.assessorName.toLocaleLowerCase(),
  signedAt: (a) => a.signedAt ?? '\uffff',
};

/**
 * Safety assessments: the shared versions waiting for an assessment (the assessor starts one
 * here), every assessment the member may see, sorted and filtered in the browser (the list is
 * one workshop's assessments, never long), and for the owner the live shares to take back.
 */
@Component({
  selector: 'bp-assessment-list',
  imports: [
    CalendarDayPipe,
    ListCard,
    MatButton,
    MatFormField,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatPrefix,
    MatSelect,
    MatSort,
    MatSortHeader,
    MatTableModule,
    RouterLink,
  ],
  templateUrl: './assessment-list.html',
  styleUrl: './assessment-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class AssessmentList {
  private readonly api = inject(AssessmentsApi);
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly submission = new SubmissionKey();

  protected readonly isAssessor = computed(() => this.session.role() === 'assessor');
  protected readonly isOwner = computed(() => this.session.hasRole(ROLE_SETS.ownerOnly));
  protected readonly columns = [
    'formulaName',
    'versionNumber',
    'status',
    'assessorName',
    'signedAt',
  ];
  protected readonly shareColumns = [
    'formulaName',
    'versionNumber',
    'assessorName',
    'sharedAt',
    'actions',
  ];

  protected readonly result = this.api.assessments();
  protected readonly shares = this.api.shares(() => this.isOwner());
  protected readonly data = computed(() =>
    this.result.hasValue() ? this.result.value() : undefined,
  );
  protected readonly waiting = computed(() => this.data()?.waiting ?? []);

  protected readonly text = signal('');
  protected readonly status = signal<AssessmentStatus | ''>('');
  protected readonly sort = signal<Sort>({ active: 'formulaName', direction: 'asc' });
  protected readonly filtered = computed(() => !!this.text().trim() || !!this.status());
  /** The assessments matching the filters, in the chosen order. */
  protected readonly rows = computed(() => {
    const words = this.text().trim().toLocaleLowerCase();
    const status = this.status();
    const rows = (this.data()?.items ?? []).filter(
      (a) =>
        (!status || a.status === status) &&
        (!words ||
          `${a.formulaName} ${a.assessorName} version ${a.versionNumber}`
            .toLocaleLowerCase()
            .includes(words)),
    );
    const { active, direction } = this.sort();
    if (!direction) return rows;
    const value = SORT_VALUE[active as SortKey] ?? SORT_VALUE.formulaName;
    const sign = direction === 'asc' ? 1 : -1;
    return [...rows].sort((a, b) => {
      const x = value(a);
      const y = value(b);
      return x < y ? -sign : x > y ? sign : 0;
    });
  });

  /** The share being started or taken back, so its button waits. */
  protected readonly busy = signal<string | null>(null);

  protected clearFilters(): void {
    this.text.set('');
    this.status.set('');
  }

  /** The assessor accepts a shared version: the assessment starts and opens. */
  protected start(share: ShareRecord): void {
    this.busy.set(share.id);
    this.api.start(share.id, this.submission.for(share.id)).subscribe({
      next: (detail) => {
        this.busy.set(null);
        this.submission.done();
        void this.router.navigate(['/assessments', detail.id]);
      },
      error: (err: unknown) => {
        this.busy.set(null);
        this.snackBar.open(messageOf(err), 'OK', { duration: 8000 });
        this.result.reload();
      },
    });
  }

  /** The owner takes a share back, after saying yes. */
  protected unshare(share: ShareRecord): void {
    confirmFirst(
      this.dialog,
      {
        title: `Stop sharing with ${share.assessorName}?`,
        message:
          `${share.assessorName} will no longer see ${share.formulaName} version ` +
          `${share.versionNumber} or the assessment written from it. What they wrote is kept; ` +
          'share the version again to give it back.',
        keep: 'Keep sharing',
        confirm: 'Unshare',
      },
      { width: '28rem' },
    ).subscribe((yes) => {
      if (!yes) return;
      this.busy.set(share.id);
      this.api.unshare(share.id).subscribe({
        next: () => {
          this.busy.set(null);
          this.snackBar.open(
            `${share.formulaName} version ${share.versionNumber} is no longer shared with ${share.assessorName}.`,
            'OK',
            { duration: 5000 },
          );
          this.shares.reload();
          this.result.reload();
        },
        error: (err: unknown) => {
          this.busy.set(null);
          this.snackBar.open(messageOf(err), 'OK', { duration: 8000 });
        },
      });
    });
  }
}
