import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatSlideToggle } from '@angular/material/slide-toggle';

/**
 * "Show archived" for a list page: archived records stay out of lists until the maker asks.
 * The page keeps the choice in the URL (`includeArchived`), like its other filters.
 */
@Component({
  selector: 'bp-archived-toggle',
  imports: [MatSlideToggle],
  template: `
    <mat-slide-toggle [checked]="checked()" (change)="changed.emit($event.checked)">
      Show archived
    </mat-slide-toggle>
  `,
  styles: `
    :host {
      display: inline-flex;
      align-items: center;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ArchivedToggle {
  /** Whether archived records are shown. */
  readonly checked = input(false);
  readonly changed = output<boolean>();
}
