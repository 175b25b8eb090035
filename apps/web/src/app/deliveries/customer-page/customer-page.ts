import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  signal,
  viewChild,
} from '@angular/core';
import { MatAnchor, MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';
import type { Customer, FieldWarning } from '@batchproof/shared';
import { FormLeaving, type LeavesSafely } from '../../forms/unsaved-changes';
import { RecordActions } from '../../housekeeping/record-actions';
import { messageOf } from '../../http/api-error';
import { CustomerForm } from '../customer-form/customer-form';
import { CustomersApi } from '../customers-api';

/** A new customer (`/deliveries/customers/new`) or one customer (`/deliveries/customers/:id`). */
@Component({
  selector: 'bp-customer-page',
  imports: [MatAnchor, MatButton, MatIcon, MatProgressBar, RecordActions, RouterLink, CustomerForm],
  template: `
    <nav class="crumbs" aria-label="Breadcrumb">
      <a routerLink="/deliveries">Deliveries</a> ›
      <a routerLink="/deliveries/customers">Customers</a>
    </nav>
    <header class="title-row">
      <h1>{{ heading() }}</h1>
      @if (current(); as c) {
        <a mat-button routerLink="/deliveries" [queryParams]="{ customerId: c.id }">
          <mat-icon>local_shipping</mat-icon>
          <span class="bp-numeric">{{ c.deliveryCount }}</span>
          {{ c.deliveryCount === 1 ? 'delivery' : 'deliveries' }}
        </a>
      }
    </header>
    @if (current(); as c) {
      <bp-record-actions
        class="housekeeping"
        kind="customers"
        [recordId]="c.id"
        [name]="c.name"
        [archived]="c.archivedAt"
        (deleted)="onDeleted()"
      />
    }
    @if (customer.isLoading()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading the customer" />
    }
    @if (loadError()) {
      <p class="bp-form-error" role="alert">
        <mat-icon aria-hidden="true">error_outline</mat-icon>{{ loadError() }}
        <button mat-button type="button" (click)="customer.reload()">Try again</button>
      </p>
    }
    @if (!id()) {
      <bp-customer-form (saved)="onCreated($event)" />
    } @else if (customer.hasValue()) {
      <bp-customer-form
        [customer]="customer.value()"
        [initialWarnings]="createdWarnings"
        (saved)="saved.set($event)"
      />
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
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 8px 16px;
      margin: 4px 0 16px;
    }
    h1 {
      margin: 0;
      font: var(--mat-sys-headline-medium);
      overflow-wrap: anywhere;
    }
    .housekeeping {
      margin-bottom: 16px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class CustomerPage implements LeavesSafely {
  /** The customer's id from the path; unset on `/deliveries/customers/new`. */
  readonly id = input<string>();

  private readonly router = inject(Router);
  /** Warnings of the create that opened this page (another customer has the name). */
  protected readonly createdWarnings: FieldWarning[] =
    (this.router.currentNavigation()?.extras.state?.['warnings'] as FieldWarning[] | undefined) ??
    [];
  private readonly customerForm = viewChild(CustomerForm);
  private readonly leaving = new FormLeaving(() => this.customerForm());
  protected readonly customer = inject(CustomersApi).customer(this.id);
  /** The latest saved copy, so the heading follows a renamed customer. */
  protected readonly saved = signal<Customer | null>(null);
  protected readonly current = computed(
    () => this.saved() ?? (this.customer.hasValue() ? this.customer.value() : null),
  );
  protected readonly heading = computed(() =>
    this.id() ? (this.current()?.name ?? 'Customer') : 'New customer',
  );
  protected readonly loadError = computed(() => {
    const error = this.customer.error();
    return error ? messageOf(error) : '';
  });

  hasUnsavedChanges(): boolean {
    return this.leaving.hasUnsavedChanges();
  }

  saveChanges(): Promise<boolean> {
    return this.leaving.saveChanges();
  }

  protected onCreated(customer: Customer): void {
    if (this.leaving.leaving) return;
    void this.router.navigate(['/deliveries/customers', customer.id], {
      replaceUrl: true,
      state: { warnings: customer.warnings ?? [] },
    });
  }

  protected onDeleted(): void {
    void this.router.navigate(['/deliveries/customers'], { replaceUrl: true });
  }
}
