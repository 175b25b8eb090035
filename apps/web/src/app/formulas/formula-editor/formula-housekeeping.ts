import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { Router } from '@angular/router';
import type { Formula } from '@batchproof/shared';
import { RecordActions } from '../../housekeeping/record-actions';

/**
 * Archive, bring back and delete for the formula on the editor's page. A deleted formula leaves
 * for the list; the API refuses to delete one with a released version (archive it instead).
 */
@Component({
  selector: 'bp-formula-housekeeping',
  imports: [RecordActions],
  template: `
    <bp-record-actions
      kind="formulas"
      [recordId]="formula().id"
      [name]="formula().name"
      [archived]="formula().archivedAt"
      (deleted)="onDeleted()"
    />
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FormulaHousekeeping {
  readonly formula = input.required<Formula>();

  private readonly router = inject(Router);

  protected onDeleted(): void {
    void this.router.navigate(['/formulas'], { replaceUrl: true });
  }
}
