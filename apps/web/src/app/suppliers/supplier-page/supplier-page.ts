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
import type { FieldWarning, Supplier } from '@batchproof/shared';
import { FormLeaving, type LeavesSafely } from '../../forms/unsaved-changes';
import { messageOf } from '../../http/api-error';
import { SupplierForm } from '../supplier-form/supplier-form';
import { SuppliersApi } from '../suppliers-api';
import { RecordActions } from '../../housekeeping/record-actions';

/** A new supplier (`/suppliers/new`) or one supplier (`/suppliers/:id`). */
@Component({
  selector: 'bp-supplier-page',
  imports: [MatAnchor, MatButton, MatIcon, MatProgressBar, RecordActions, RouterLink, SupplierForm],
  template: `
    <nav class="crumbs" aria-label="Breadcrumb">
      <a routerLink="/materials">Materials</a> › <a routerLink="/suppliers">Suppliers</a>
    </nav>
    <header class="title-row">
      <h1>{{ heading() }}</h1>
      @if (current(); as s) {
        <a mat-button routerLink="/materials" [queryParams]="{ supplierId: s.id }">
          <mat-icon>inventory_2</mat-icon>
          <span class="bp-numeric">{{ s.materialCount }}</span> material(s)
        </a>
      }
    </header>
    @if (current(); as s) {
      <bp-record-actions
        class="housekeeping"
        kind="suppliers"
        [recordId]="s.id"
        [name]="s.name"
        [archived]="s.archivedAt"
        (deleted)="onDeleted()"
      />
    }
    @if (supplier.isLoading()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading the supplier" />
    }
    @if (loadError()) {
      <p class="bp-form-error" role="alert">
        <mat-icon aria-hidden="true">error_outline</mat-icon>{{ loadError() }}
        <button mat-button type="button" (click)="supplier.reload()">Try again</button>
      </p>
    }
    @if (!id()) {
      <bp-supplier-form (saved)="onCreated($event)" />
    } @else if (supplier.hasValue()) {
      <bp-supplier-form
        [supplier]="supplier.value()"
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
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class SupplierPage implements LeavesSafely {
  /** The supplier's id from the path; unset on `/suppliers/new`. */
  readonly id = input<string>();

  private readonly router = inject(Router);
  /** Warnings of the create that opened this page (another supplier has the name). */
  protected readonly createdWarnings: FieldWarning[] =
    (this.router.currentNavigation()?.extras.state?.['warnings'] as FieldWarning[] | undefined) ??
    [];
  private readonly supplierForm = viewChild(SupplierForm);
  private readonly leaving = new FormLeaving(() => this.supplierForm());
  protected readonly supplier = inject(SuppliersApi).supplier(this.id);
  /** The latest saved copy, so the heading follows a renamed supplier. */
  protected readonly saved = signal<Supplier | null>(null);
  protected readonly current = computed(
    () => this.saved() ?? (this.supplier.hasValue() ? this.supplier.value() : null),
  );
  protected readonly heading = computed(() =>
    this.id() ? (this.current()?.name ?? 'Supplier') : 'New supplier',
  );
  protected readonly loadError = computed(() => {
    const error = this.supplier.error();
    return error ? messageOf(error) : '';
  });

  hasUnsavedChanges(): boolean {
    return this.leaving.hasUnsavedChanges();
  }

  saveChanges(): Promise<boolean> {
    return this.leaving.saveChanges();
  }

  protected onCreated(supplier: Supplier): void {
    if (this.leaving.leaving) return;
    // The warnings of the create go along, so the supplier's own page shows them.
    void this.router.navigate(['/suppliers', supplier.id], {
      replaceUrl: true,
      state: { warnings: supplier.warnings ?? [] },
    });
  }

  protected onDeleted(): void {
    void this.router.navigate(['/suppliers'], { replaceUrl: true });
  }
}
