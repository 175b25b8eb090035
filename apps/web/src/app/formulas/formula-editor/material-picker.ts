import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  output,
  signal,
} from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule } from '@angular/forms';
import { MatAutocomplete, MatAutocompleteTrigger } from '@angular/material/autocomplete';
import { MatOption } from '@angular/material/core';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { debounceTime } from 'rxjs';
import type { MaterialSummary } from '@batchproof/shared';
import { errorMessage } from '../../forms/form-errors';
import { FormulasApi } from '../formulas-api';
import type { LineGroup } from './formula-form';

/**
 * Picks a line's material by typing part of its trade name, INCI name or CAS number; the workshop's
 * materials are searched on the server. Choosing one sets the line's material; typing over it
 * clears the choice until another is picked.
 */
@Component({
  selector: 'bp-material-picker',
  imports: [
    ReactiveFormsModule,
    MatAutocomplete,
    MatAutocompleteTrigger,
    MatError,
    MatFormField,
    MatInput,
    MatLabel,
    MatOption,
  ],
  template: `
    <mat-form-field subscriptSizing="dynamic">
      <mat-label>{{ label() }}</mat-label>
      <input
        matInput
        [formControl]="line().controls.materialName"
        [matAutocomplete]="auto"
        (focus)="open()"
        (input)="typed($any($event.target).value)"
      />
      <mat-autocomplete #auto="matAutocomplete" autoActiveFirstOption>
        @for (m of options(); track m.id) {
          <mat-option [value]="m.tradeName" (onSelectionChange)="$event.isUserInput && pick(m)">
            <span class="trade">{{ m.tradeName }}</span>
            <span class="inci">{{ m.inci }}</span>
          </mat-option>
        } @empty {
          <mat-option disabled [value]="null">{{ emptyText() }}</mat-option>
        }
      </mat-autocomplete>
      <mat-error>{{ errorMessage(line().controls.materialName) }}</mat-error>
    </mat-form-field>
  `,
  styles: `
    :host {
      display: block;
      min-width: 0;
    }
    mat-form-field {
      width: 100%;
    }
    .trade {
      font-weight: 600;
    }
    .inci {
      margin-left: 8px;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaterialPicker {
  readonly line = input.required<LineGroup>();
  readonly label = input('Material');
  /** Emits the material the maker chose. */
  readonly picked = output<MaterialSummary>();

  /** What to search for; null until the field is first focused, so idle lines ask nothing. */
  private readonly search = signal<string | null>(null);
  private readonly debounced = toSignal(toObservable(this.search).pipe(debounceTime(200)), {
    initialValue: null,
  });
  private readonly results = inject(FormulasApi).searchMaterials(this.debounced);
  protected readonly options = computed(() =>
    this.results.hasValue() ? this.results.value() : [],
  );
  protected readonly emptyText = computed(() =>
    this.results.isLoading() || this.search() !== this.debounced()
      ? 'Searching…'
      : 'No material matches. Add it under Materials first.',
  );
  protected readonly errorMessage = errorMessage;

  protected open(): void {
    if (this.search() === null) this.search.set('');
  }

  protected typed(text: string): void {
    // Whatever was chosen no longer matches what the field says.
    this.line().controls.materialId.setValue('');
    this.search.set(text);
  }

  protected pick(material: MaterialSummary): void {
    this.line().patchValue({ materialId: material.id, materialName: material.tradeName });
    this.picked.emit(material);
  }
}
