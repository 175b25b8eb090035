import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  linkedSignal,
  output,
  signal,
} from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { ROLE_SETS } from '@batchproof/shared';
import { Session } from '../auth/session';
import { messageOf } from '../http/api-error';
import { type ArchivableKind, HousekeepingApi } from './housekeeping-api';

/**
 * Archive, bring back and delete for one record, for the members who may write it. Delete asks
 * once more before it goes; when something refers to the record the API refuses and its reason
 * (what refers to it, and to archive instead) is shown here.
 */
@Component({
  selector: 'bp-record-actions',
  imports: [MatButton, MatIcon],
  template: `
    @if (canWrite()) {
      <div class="actions" role="group" [attr.aria-label]="'Housekeeping for ' + name()">
        @if (archivedAt()) {
          <span class="archived" role="status">
            <mat-icon aria-hidden="true">inventory</mat-icon>Archived
            {{ archivedAt()!.slice(0, 10) }}
          </span>
          <button mat-stroked-button type="button" [disabled]="busy()" (click)="setArchived(false)">
            <mat-icon>unarchive</mat-icon>Bring back
          </button>
        } @else {
          <button mat-stroked-button type="button" [disabled]="busy()" (click)="setArchived(true)">
            <mat-icon>archive</mat-icon>Archive
          </button>
        }
        @if (confirming()) {
          <span class="confirm" role="alert">Delete {{ name() }} for good?</span>
          <button
            mat-flat-button
            type="button"
            class="danger"
            [disabled]="busy()"
            (click)="remove()"
          >
            <mat-icon>delete_forever</mat-icon>Delete for good
          </button>
          <button mat-button type="button" (click)="confirming.set(false)">Keep it</button>
        } @else {
          <button mat-button type="button" [disabled]="busy()" (click)="askToDelete()">
            <mat-icon>delete</mat-icon>Delete
          </button>
        }
      </div>
      @if (notice()) {
        <p class="bp-form-error" role="alert">
          <mat-icon aria-hidden="true">error_outline</mat-icon>{{ notice() }}
        </p>
      }
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .actions {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 8px;
    }
    .archived,
    .confirm {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      font: var(--mat-sys-body-medium);
    }
    .danger {
      --mat-button-filled-container-color: var(--mat-sys-error);
      --mat-button-filled-label-text-color: var(--mat-sys-on-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecordActions {
  readonly kind = input.required<ArchivableKind>();
  readonly recordId = input.required<string>();
  /** The record's name, as the buttons and the question say it. */
  readonly name = input.required<string>();
  /** When the record was archived; null or unset while it is in use. */
  readonly archived = input<string | null | undefined>(null);
  /** Emits the new archive date (null once brought back) after archiving or bringing back. */
  readonly archivedChange = output<string | null>();
  /** Emits once the record is deleted. */
  readonly deleted = output<void>();

  private readonly api = inject(HousekeepingApi);
  private readonly session = inject(Session);

  /** Whether the signed-in member may archive and delete records. */
  protected readonly canWrite = computed(() => this.session.hasRole(ROLE_SETS.writers));
  protected readonly archivedAt = linkedSignal(() => this.archived() ?? null);
  protected readonly busy = signal(false);
  protected readonly confirming = signal(false);
  protected readonly notice = signal('');

  protected setArchived(archived: boolean): void {
    this.start();
    this.api.setArchived(this.kind(), this.recordId(), archived).subscribe({
      next: (state) => {
        this.busy.set(false);
        this.archivedAt.set(state.archivedAt);
        this.archivedChange.emit(state.archivedAt);
      },
      error: (err: unknown) => this.fail(err),
    });
  }

  protected askToDelete(): void {
    this.notice.set('');
    this.confirming.set(true);
  }

  protected remove(): void {
    this.start();
    this.api.delete(this.kind(), this.recordId()).subscribe({
      next: () => {
        this.busy.set(false);
        this.deleted.emit();
      },
      error: (err: unknown) => this.fail(err),
    });
  }

  private start(): void {
    this.busy.set(true);
    this.confirming.set(false);
    this.notice.set('');
  }

  private fail(err: unknown): void {
    this.busy.set(false);
    this.notice.set(messageOf(err));
  }
}
