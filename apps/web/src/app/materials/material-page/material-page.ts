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
import { Router, RouterLink } from '@angular/router';
import type { Material } from '@batchproof/shared';
import { DocumentPanel } from '../../documents/document-panel/document-panel';
import { FormLeaving, type LeavesSafely } from '../../forms/unsaved-changes';
import { messageOf } from '../../http/api-error';
import { MaterialForm } from '../material-form/material-form';
import { CATEGORY_LABELS } from '../material-labels';
import { MaterialsApi } from '../materials-api';
import { RecordActions } from '../../housekeeping/record-actions';

/**
 * A new material (`/materials/new`) or one material (`/materials/:id`): the form on the left,
 * its supplier documents and their status on the right.
 */
@Component({
  selector: 'bp-material-page',
  imports: [
    MatButton,
    MatIcon,
    MatProgressBar,
    RouterLink,
    DocumentPanel,
    MaterialForm,
    RecordActions,
  ],
  template: `
    <nav class="crumbs" aria-label="Breadcrumb"><a routerLink="/materials">Materials</a></nav>
    <header class="title-row">
      <h1>{{ heading() }}</h1>
      @if (category()) {
        <span class="category">{{ category() }}</span>
      }
    </header>
    @if (material.hasValue()) {
      <bp-record-actions
        class="housekeeping"
        kind="materials"
        [recordId]="material.value().id"
        [name]="heading()"
        [archived]="material.value().archivedAt"
        (deleted)="onDeleted()"
      />
    }
    @if (material.isLoading()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading the material" />
    }
    @if (loadError()) {
      <p class="bp-form-error" role="alert">
        <mat-icon aria-hidden="true">error_outline</mat-icon>{{ loadError() }}
        <button mat-button type="button" (click)="material.reload()">Try again</button>
      </p>
    }
    @if (!id()) {
      <div class="layout">
        <bp-material-form class="main" (saved)="onCreated($event)" />
        <aside class="side">
          <p class="hint">
            <mat-icon aria-hidden="true">info</mat-icon>
            Save the material first; then upload its safety data sheet and certificates here.
          </p>
        </aside>
      </div>
    } @else if (material.hasValue()) {
      <div class="layout">
        <bp-material-form class="main" [material]="material.value()" (saved)="onSaved($event)" />
        <aside class="side">
          <bp-document-panel [materialId]="material.value().id" />
        </aside>
      </div>
    }
  `,
  styleUrl: './material-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class MaterialPage implements LeavesSafely {
  /** The material's id from the path; unset on `/materials/new`. */
  readonly id = input<string>();

  private readonly router = inject(Router);
  private readonly materialForm = viewChild(MaterialForm);
  private readonly leaving = new FormLeaving(() => this.materialForm());
  protected readonly material = inject(MaterialsApi).material(this.id);
  /** The latest saved copy, so the heading follows a renamed material without a reload. */
  private readonly saved = signal<Material | null>(null);
  private readonly current = computed(
    () => this.saved() ?? (this.material.hasValue() ? this.material.value() : null),
  );
  protected readonly heading = computed(() =>
    this.id() ? (this.current()?.tradeName ?? 'Material') : 'New material',
  );
  protected readonly category = computed(() => {
    const c = this.current()?.category;
    return c ? CATEGORY_LABELS[c] : '';
  });
  protected readonly loadError = computed(() => {
    const error = this.material.error();
    return error ? messageOf(error) : '';
  });

  hasUnsavedChanges(): boolean {
    return this.leaving.hasUnsavedChanges();
  }

  saveChanges(): Promise<boolean> {
    return this.leaving.saveChanges();
  }

  protected onCreated(material: Material): void {
    if (this.leaving.leaving) return;
    void this.router.navigate(['/materials', material.id], { replaceUrl: true });
  }

  protected onDeleted(): void {
    void this.router.navigate(['/materials'], { replaceUrl: true });
  }

  protected onSaved(material: Material): void {
    this.saved.set(material);
  }
}
