import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  linkedSignal,
  output,
  signal,
  viewChild,
} from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatIconButton } from '@angular/material/button';
import type { ErrorStateMatcher } from '@angular/material/core';
import { MatAutocomplete, MatAutocompleteTrigger, MatOption } from '@angular/material/autocomplete';
import {
  MatError,
  MatFormField,
  type MatFormFieldAppearance,
  MatHint,
  MatLabel,
  MatPrefix,
  MatSuffix,
} from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { debounceTime, distinctUntilChanged } from 'rxjs';
import type { MaterialSummary } from '@batchproof/shared';
import { messageOf } from '../../http/api-error';
import { LotsApi } from '../lots-api';

/**
 * Picks one of the workshop's materials by typing part of its name, INCI or CAS number; the
 * server does the matching. Shows `error` (from the form-errors adapter) as its `<mat-error>`.
 */
@Component({
  selector: 'bp-material-picker',
  imports: [
    MatAutocomplete,
    MatAutocompleteTrigger,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatIconButton,
    MatInput,
    MatLabel,
    MatOption,
    MatPrefix,
    MatSuffix,
  ],
  template: `
    <mat-form-field [appearance]="appearance()" [subscriptSizing]="subscriptSizing()">
      <mat-label>{{ label() }}</mat-label>
      @if (searchIcon()) {
        <mat-icon matPrefix aria-hidden="true">inventory_2</mat-icon>
      }
      <input
        matInput
        [value]="text()"
        [matAutocomplete]="auto"
        [errorStateMatcher]="matcher"
        [required]="required()"
        [disabled]="disabled()"
        (focus)="active.set(true)"
        (input)="type($any($event.target).value)"
      />
      <mat-autocomplete
        #auto="matAutocomplete"
        [displayWith]="nameOf"
        autoActiveFirstOption
        (optionSelected)="choose($event.option.value)"
      >
        @for (m of options(); track m.id) {
          <mat-option [value]="m">
            <span class="name">{{ m.tradeName }}</span>
            <span class="inci"> — {{ m.inci }}</span>
          </mat-option>
        }
        @if (optionsNote(); as note) {
          <mat-option disabled>{{ note }}</mat-option>
        }
      </mat-autocomplete>
      @if (text() && !disabled()) {
        <button
          mat-icon-button
          matSuffix
          type="button"
          [attr.aria-label]="'Clear ' + label()"
          (click)="clear()"
        >
          <mat-icon>close</mat-icon>
        </button>
      }
      @if (hint()) {
        <mat-hint>{{ hint() }}</mat-hint>
      }
      <mat-error>{{ error() }}</mat-error>
    </mat-form-field>
  `,
  styles: `
    :host {
      display: block;
    }
    mat-form-field {
      width: 100%;
    }
    .name {
      font-weight: 600;
    }
    .inci {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaterialPicker {
  /** The chosen material's id, or null for none. */
  readonly materialId = input<string | null | undefined>(null);
  /** The chosen material's name when the caller already knows it (saves a request). */
  readonly materialName = input<string | null | undefined>(null);
  readonly label = input('Material');
  readonly hint = input('');
  /** The message to show under the field; the field is marked invalid while there is one. */
  readonly error = input('');
  /** Whether a material must be chosen (marks the label). */
  readonly required = input(false);
  /** Whether the field is read-only. */
  readonly disabled = input(false);
  /** Whether to lead with a search icon (as a filter does). */
  readonly searchIcon = input(false);
  readonly appearance = input<MatFormFieldAppearance>('fill');
  readonly subscriptSizing = input<'fixed' | 'dynamic'>('fixed');
  /** Emits the material picked, or null when the field is cleared or retyped. */
  readonly picked = output<MaterialSummary | null>();

  private readonly api = inject(LotsApi);
  /** The material picked here, so its name shows without asking the server again. */
  private readonly chosen = signal<MaterialSummary | null>(null);
  /** Whether the field has had focus; options are read only from then on. */
  protected readonly active = signal(false);

  /** The material to look up by id, when its name is known neither here nor to the caller. */
  private readonly lookupId = computed(() => {
    const id = this.materialId();
    if (!id || this.materialName() || this.chosen()?.id === id) return undefined;
    return id;
  });
  private readonly lookup = this.api.material(this.lookupId);
  private readonly known = computed(() => {
    const id = this.materialId() || null;
    const chosen = this.chosen();
    let name = '';
    if (id && chosen?.id === id) name = chosen.tradeName;
    else if (id && this.materialName()) name = this.materialName()!;
    else if (id && this.lookup.hasValue()) name = this.lookup.value().tradeName;
    return { id, name };
  });
  /**
   * What the field shows: the chosen material's name, or what the user has typed while no
   * material is chosen (un-choosing must not wipe the text being typed).
   */
  protected readonly text = linkedSignal<{ id: string | null; name: string }, string>({
    source: this.known,
    computation: ({ id, name }, previous) => name || (id ? '' : (previous?.value ?? '')),
  });

  private readonly search = toSignal(
    toObservable(this.text).pipe(debounceTime(250), distinctUntilChanged()),
    { initialValue: '' },
  );
  private readonly optionsResource = this.api.materialOptions(() =>
    this.active() ? this.search() : undefined,
  );
  protected readonly options = computed(() =>
    this.optionsResource.hasValue() ? this.optionsResource.value() : [],
  );
  protected readonly optionsNote = computed(() => {
    if (!this.active()) return '';
    if (this.optionsResource.isLoading()) return 'Looking for materials…';
    const error = this.optionsResource.error();
    if (error) return messageOf(error);
    if (this.options().length === 0) {
      return this.search()
        ? 'No material matches. Add it under Materials first.'
        : 'No materials yet. Add one under Materials first.';
    }
    return '';
  });

  protected readonly matcher: ErrorStateMatcher = { isErrorState: () => this.error() !== '' };
  private readonly inputField = viewChild.required(MatInput);

  constructor() {
    // MatInput re-reads its error state by itself only when it has a form control; this input
    // has none (the caller owns the value), so tell it whenever the message changes.
    effect(() => {
      this.error();
      this.inputField().updateErrorState();
    });
  }
  protected readonly nameOf = (m: MaterialSummary | string | null) =>
    typeof m === 'string' ? m : (m?.tradeName ?? '');

  protected type(value: string): void {
    this.text.set(value);
    this.active.set(true);
    // Typing over a chosen material un-chooses it, so a half-typed name is never saved.
    if (this.materialId()) {
      this.chosen.set(null);
      this.picked.emit(null);
    }
  }

  protected choose(material: MaterialSummary): void {
    this.chosen.set(material);
    this.text.set(material.tradeName);
    this.picked.emit(material);
  }

  protected clear(): void {
    this.chosen.set(null);
    this.text.set('');
    if (this.materialId()) this.picked.emit(null);
  }
}
