import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatIconButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';

/**
 * One row of a repeating form section (blend components, IFRA categories, allergens,
 * calibrations): the row's fields, projected, wrapping as the width allows, and a remove button
 * with its own accessible name. Put it inside the `<li [formGroup]="row">` of the list.
 */
@Component({
  selector: 'bp-editable-row',
  imports: [MatIcon, MatIconButton],
  template: `
    <div class="fields"><ng-content /></div>
    @if (removable()) {
      <button
        mat-icon-button
        type="button"
        class="remove"
        [attr.aria-label]="removeLabel()"
        (click)="remove.emit()"
      >
        <mat-icon>delete_outline</mat-icon>
      </button>
    }
  `,
  styles: `
    :host {
      display: flex;
      align-items: flex-start;
      gap: 4px;
    }
    .fields {
      flex: 1 1 auto;
      min-width: 0;
      display: flex;
      flex-wrap: wrap;
      gap: 0 12px;
    }
    .remove {
      margin-top: 8px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EditableRow {
  /** Accessible name of the remove button, e.g. "Remove component 2". */
  readonly removeLabel = input.required<string>();
  /** Whether the row may be removed (false when the form is read-only). */
  readonly removable = input(true);
  /** Emits when the member asks to remove the row. */
  readonly remove = output<void>();
}
