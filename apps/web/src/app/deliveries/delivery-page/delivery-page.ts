import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  signal,
  viewChild,
} from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, RouterLink } from '@angular/router';
import { type Delivery, ROLE_SETS } from '@batchproof/shared';
import { Session } from '../../auth/session';
import { CalendarDayPipe } from '../../dates/calendar-day-pipe';
import { FormLeaving, type LeavesSafely } from '../../forms/unsaved-changes';
import { messageOf } from '../../http/api-error';
import { DeliveriesApi } from '../deliveries-api';
import { DeliveryForm } from '../delivery-form/delivery-form';

/**
 * A new delivery (`/deliveries/new`) or one delivery (`/deliveries/:id`): the form for those who
 * record deliveries, the recorded details for everyone else. Only owners and formulators delete.
 */
@Component({
  selector: 'bp-delivery-page',
  imports: [CalendarDayPipe, DeliveryForm, MatButton, MatIcon, MatProgressBar, RouterLink],
  template: `
    <nav class="crumbs" aria-label="Breadcrumb"><a routerLink="/deliveries">Deliveries</a></nav>
    <header class="title-row">
      <h1>{{ heading() }}</h1>
    </header>
    @if (current(); as d) {
      <p class="lead">
        <span class="bp-numeric">{{ d.totalUnits }}</span> units to
        <a [routerLink]="['/deliveries/customers', d.customerId]">{{ d.customerName }}</a> on
        <time [attr.datetime]="d.deliveredOn">{{ d.deliveredOn | day }}</time>.
      </p>
      @if (canDelete()) {
        <div class="actions" role="group" aria-label="Delete this delivery">
          @if (confirming()) {
            <span class="confirm" role="alert">Delete this delivery for good?</span>
            <button
              mat-flat-button
              type="button"
              class="danger"
              [disabled]="deleting()"
              (click)="remove(d)"
            >
              <mat-icon>delete_forever</mat-icon>Delete for good
            </button>
            <button mat-button type="button" (click)="confirming.set(false)">Keep it</button>
          } @else {
            <button mat-button type="button" (click)="confirming.set(true)">
              <mat-icon>delete</mat-icon>Delete
            </button>
          }
        </div>
      }
      @if (deleteError()) {
        <p class="bp-form-error" role="alert">
          <mat-icon aria-hidden="true">error_outline</mat-icon>{{ deleteError() }}
        </p>
      }
    }
    @if (delivery.isLoading()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading the delivery" />
    }
    @if (loadError()) {
      <p class="bp-form-error" role="alert">
        <mat-icon aria-hidden="true">error_outline</mat-icon>{{ loadError() }}
        <button mat-button type="button" (click)="delivery.reload()">Try again</button>
      </p>
    }
    @if (!id()) {
      <bp-delivery-form (saved)="onCreated($event)" />
    } @else if (delivery.hasValue()) {
      <bp-delivery-form [delivery]="delivery.value()" (saved)="saved.set($event)" />
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .crumbs {
      font: var(--mat-sys-body-medium);
    }
    .title-row {
      margin: 4px 0 8px;
    }
    h1 {
      margin: 0;
      font: var(--mat-sys-headline-medium);
      overflow-wrap: anywhere;
    }
    .lead {
      margin: 0 0 12px;
      color: var(--mat-sys-on-surface-variant);
    }
    .actions {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 8px;
      margin-bottom: 16px;
    }
    .danger {
      --mat-button-filled-container-color: var(--mat-sys-error);
      --mat-button-filled-label-text-color: var(--mat-sys-on-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class DeliveryPage implements LeavesSafely {
  /** The delivery's id from the path; unset on `/deliveries/new`. */
  readonly id = input<string>();

  private readonly api = inject(DeliveriesApi);
  private readonly router = inject(Router);
  private readonly session = inject(Session);
  private readonly snackBar = inject(MatSnackBar);
  private readonly deliveryForm = viewChild(DeliveryForm);
  private readonly leaving = new FormLeaving(() => this.deliveryForm());

  protected readonly delivery = this.api.delivery(this.id);
  /** The latest saved copy, so the heading follows a change of customer. */
  protected readonly saved = signal<Delivery | null>(null);
  protected readonly current = computed(
    () => this.saved() ?? (this.delivery.hasValue() ? this.delivery.value() : null),
  );
  protected readonly heading = computed(() => {
    if (!this.id()) return 'New delivery';
    const d = this.current();
    return d ? `Delivery ${d.reference ?? ''} to ${d.customerName}`.replace('  ', ' ') : 'Delivery';
  });
  protected readonly loadError = computed(() => {
    const error = this.delivery.error();
    return error ? messageOf(error) : '';
  });
  protected readonly canDelete = computed(() => this.session.hasRole(ROLE_SETS.writers));
  protected readonly confirming = signal(false);
  protected readonly deleting = signal(false);
  protected readonly deleteError = signal('');

  hasUnsavedChanges(): boolean {
    return this.leaving.hasUnsavedChanges();
  }

  saveChanges(): Promise<boolean> {
    return this.leaving.saveChanges();
  }

  protected onCreated(delivery: Delivery): void {
    if (this.leaving.leaving) return;
    void this.router.navigate(['/deliveries', delivery.id], { replaceUrl: true });
  }

  protected remove(delivery: Delivery): void {
    this.deleting.set(true);
    this.deleteError.set('');
    this.api.delete(delivery.id).subscribe({
      next: () => {
        this.deleting.set(false);
        this.snackBar.open(`Deleted the delivery to ${delivery.customerName}.`, 'OK', {
          duration: 4000,
        });
        void this.router.navigate(['/deliveries'], { replaceUrl: true });
      },
      error: (err: unknown) => {
        this.deleting.set(false);
        this.confirming.set(false);
        this.deleteError.set(messageOf(err));
      },
    });
  }
}
