import {
  afterNextRender,
  ChangeDetectionStrategy,
  Component,
  ElementRef,
  inject,
  Injector,
  input,
  signal,
} from '@angular/core';
import type { FormControl } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatChip, MatChipRemove, MatChipSet } from '@angular/material/chips';
import { MatIcon } from '@angular/material/icon';
import {
  MAX_SUBSTITUTES_PER_LINE,
  type MaterialListItem,
  type StoredSubstitute,
} from '@batchproof/shared';
import { MaterialPicker } from '../../materials/material-picker/material-picker';

/**
 * A line's approved substitutes: materials the line may be made with instead (one starch or
 * another), each checked by the engine like the line's own. Shown as removable chips (Delete or
 * Backspace on a focused chip removes it); "Add substitute" opens the one material picker and
 * closes it once a material is picked or Escape is pressed, returning the focus to the button.
 */
@Component({
  selector: 'bp-line-substitutes',
  imports: [MatButton, MatChip, MatChipRemove, MatChipSet, MatIcon, MaterialPicker],
  template: `
    @let list = substitutes();
    @if (list.length > 0 || !readOnly()) {
      <div
        class="row"
        role="group"
        [attr.aria-label]="'Approved substitutes, line ' + lineNumber()"
      >
        <span class="label" aria-hidden="true">Or:</span>
        @if (list.length > 0) {
          <mat-chip-set [attr.aria-label]="'Approved substitutes, line ' + lineNumber()">
            @for (s of list; track s.materialId) {
              <mat-chip
                [removable]="!readOnly()"
                [highlighted]="false"
                (removed)="remove(s.materialId)"
              >
                {{ s.materialName }}
                @if (!readOnly()) {
                  <button
                    matChipRemove
                    type="button"
                    [attr.aria-label]="
                      'Remove substitute ' + s.materialName + ', line ' + lineNumber()
                    "
                  >
                    <mat-icon>cancel</mat-icon>
                  </button>
                }
              </mat-chip>
            }
          </mat-chip-set>
        }
        @if (!readOnly()) {
          @if (picking()) {
            <bp-material-picker
              class="picker"
              subscriptSizing="dynamic"
              [label]="'Substitute for line ' + lineNumber()"
              [value]="null"
              (picked)="add($event)"
              (keydown.escape)="closePicker()"
            />
          } @else if (list.length < max) {
            <button mat-button type="button" class="add" (click)="openPicker()">
              <mat-icon>add</mat-icon>
              {{ list.length === 0 ? 'Add approved substitute' : 'Add another' }}
            </button>
          }
        }
      </div>
      @if (message(); as m) {
        <p class="bp-form-error" role="alert">
          <mat-icon aria-hidden="true">error_outline</mat-icon>{{ m }}
        </p>
      }
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .row {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 4px 8px;
    }
    .label {
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-small);
    }
    .picker {
      flex: 1 1 14rem;
      min-width: 0;
    }
    .bp-form-error {
      margin: 4px 0 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LineSubstitutes {
  /** The line's `substitutes` control, which this changes. */
  readonly control = input.required<FormControl<StoredSubstitute[]>>();
  /** The control's value as the parent's form value holds it (so the chips follow every change). */
  readonly substitutes = input.required<readonly StoredSubstitute[]>();
  /** The contract's message for the line's substitutes, or ''. */
  readonly message = input('');
  /** The line's number as shown (1-based). */
  readonly lineNumber = input.required<number>();
  readonly readOnly = input(false);

  protected readonly max = MAX_SUBSTITUTES_PER_LINE;
  protected readonly picking = signal(false);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);
  private readonly injector = inject(Injector);

  protected openPicker(): void {
    this.picking.set(true);
    this.focus('bp-material-picker input');
  }

  protected closePicker(): void {
    this.picking.set(false);
    this.focus('button.add');
  }

  protected add(material: MaterialListItem | null): void {
    if (!material) return;
    const control = this.control();
    control.setValue([
      ...control.value,
      { materialId: material.id, materialName: material.tradeName },
    ]);
    control.markAsDirty();
    this.closePicker();
  }

  protected remove(materialId: string): void {
    const control = this.control();
    control.setValue(control.value.filter((s) => s.materialId !== materialId));
    control.markAsDirty();
    this.focus('button.add, mat-chip');
  }

  private focus(selector: string): void {
    afterNextRender(() => this.host.nativeElement.querySelector<HTMLElement>(selector)?.focus(), {
      injector: this.injector,
    });
  }
}
