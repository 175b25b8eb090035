import {
  booleanAttribute,
  ChangeDetectionStrategy,
  Component,
  computed,
  DestroyRef,
  type DoCheck,
  effect,
  inject,
  input,
  linkedSignal,
  output,
  signal,
  viewChild,
} from '@angular/core';
import { rxResource, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { type AbstractControl, type ControlValueAccessor, NgControl } from '@angular/forms';
import { MatAutocomplete, MatAutocompleteTrigger, MatOption } from '@angular/material/autocomplete';
import { MatIconButton } from '@angular/material/button';
import type { ErrorStateMatcher } from '@angular/material/core';
import {
  MatError,
  MatFormField,
  type MatFormFieldAppearance,
  MatHint,
  MatLabel,
  MatPrefix,
  MatSuffix,
  type SubscriptSizing,
} from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { debounceTime, distinctUntilChanged, of, type Subscription } from 'rxjs';
import type { MaterialListItem } from '@batchproof/shared';
import { errorMessage } from '../../forms/form-errors';
import { messageOf } from '../../http/api-error';
import { MaterialsApi } from '../materials-api';

/**
 * The one way to choose a material, wherever one is chosen (formula lines, goods-in, the lots
 * filter): type part of its trade name, INCI name, CAS number or a blend component's INCI name;
 * the server matches and ranks (own names first), and an option found only through a component
 * says so. A Material autocomplete, so it is a combobox for the keyboard and screen readers.
 *
 * Bind it like any form field: `formControlName` / `[formControl]` on a control holding the
 * material's id ('' for none); it shows that control's message from the form-errors adapter.
 * Outside a form (a list filter) give `[value]` and listen to `(picked)`, as with `mat-select`.
 * Typing over a chosen material un-chooses it, so a half-typed name is never saved.
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
  templateUrl: './material-picker.html',
  styleUrl: './material-picker.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaterialPicker implements ControlValueAccessor, DoCheck {
  /** The chosen material's id when no form control is bound (a filter read from the URL). */
  readonly value = input<string | null | undefined>(null);
  /** The chosen material's name when the caller already knows it (saves a read). */
  readonly materialName = input<string | null | undefined>(null);
  readonly label = input('Material');
  readonly hint = input('');
  /** Whether a material must be chosen (marks the label). */
  readonly required = input(false, { transform: booleanAttribute });
  /** Whether to lead with an icon (as a filter does). */
  readonly searchIcon = input(false, { transform: booleanAttribute });
  /** Whether to offer a button that clears the field (a row of many pickers leaves it out). */
  readonly clearable = input(true, { transform: booleanAttribute });
  readonly appearance = input<MatFormFieldAppearance>('fill');
  readonly subscriptSizing = input<SubscriptSizing>('fixed');
  /** Emits the material picked, or null when the field is cleared or typed over. */
  readonly picked = output<MaterialListItem | null>();

  private readonly api = inject(MaterialsApi);
  /** The form control bound to this picker, if any; its value is the chosen material's id. */
  private readonly ngControl = inject(NgControl, { self: true, optional: true });

  /** The chosen material's id: the bound control's (through `writeValue`) or `value`'s. */
  private readonly id = linkedSignal<string | null>(() => this.value() || null);
  protected readonly disabled = signal(false);
  /** The material picked here, so its name shows without asking the server again. */
  private readonly chosen = signal<MaterialListItem | null>(null);
  /** Whether the field has had focus; options are read only from then on. */
  protected readonly active = signal(false);

  /**
   * The chosen material's name: the cached record's first (it follows saves made in the materials
   * screens), then the one picked here, then the caller's.
   */
  private readonly knownName = computed(() => {
    const id = this.id();
    if (!id) return '';
    const chosen = this.chosen();
    return (
      this.api.cached(id)?.tradeName ??
      (chosen?.id === id ? chosen.tradeName : this.materialName()) ??
      ''
    );
  });
  /** An id whose name nobody knows yet is read through the cache (its name then shows). */
  private readonly lookup = rxResource({
    params: () => (this.id() && !this.knownName() ? this.id()! : undefined),
    stream: ({ params }) => (params ? this.api.record(params) : of(undefined)),
  });
  /**
   * What the field shows: the chosen material's name, or what the user has typed while no
   * material is chosen (un-choosing must not wipe the text being typed).
   */
  protected readonly text = linkedSignal<{ id: string | null; name: string }, string>({
    source: computed(() => ({ id: this.id(), name: this.knownName() })),
    computation: ({ id, name }, previous) => name || (id ? '' : (previous?.value ?? '')),
  });

  /** What to search for once the field has had focus; undefined before, so idle pickers ask nothing. */
  private readonly wanted = computed(() => (this.active() ? this.text() : undefined));
  /** `wanted` after a pause in typing: one request per pause, not per keystroke. */
  private readonly search = toSignal(
    toObservable(this.wanted).pipe(debounceTime(250), distinctUntilChanged()),
    { initialValue: undefined },
  );
  private readonly results = this.api.search(this.search);
  protected readonly options = computed(() =>
    this.results.hasValue() ? this.results.value() : [],
  );
  protected readonly optionsNote = computed(() => {
    if (!this.active()) return '';
    if (this.results.isLoading() || this.search() !== this.wanted()) {
      return 'Looking for materials…';
    }
    const error = this.results.error();
    if (error) return messageOf(error);
    if (this.options().length === 0) {
      return this.search()
        ? 'No material matches. Add it under Materials first.'
        : 'No materials yet. Add one under Materials first.';
    }
    return '';
  });
  /** Said to screen readers when a search answers: how many options, and how they matched. */
  protected readonly found = computed(() => {
    if (this.optionsNote() === 'Looking for materials…' || !this.results.hasValue()) return '';
    const options = this.options();
    const viaComponent = options.filter((m) => m.matchedIn === 'components').length;
    if (options.length === 0) return 'No material matches.';
    const count = options.length === 1 ? '1 material' : `${options.length} materials`;
    return viaComponent > 0
      ? `${count} found, ${viaComponent} of them through a blend component.`
      : `${count} found.`;
  });

  /** The bound control and a counter that moves with its events (status, touched, value). */
  private control: AbstractControl | null = null;
  private controlEvents?: Subscription;
  private readonly controlChanged = signal(0);
  /** The bound control's message once it has been touched (the form-errors adapter sets it). */
  protected readonly error = computed(() => {
    this.controlChanged();
    const control = this.control;
    return control?.touched ? errorMessage(control) : '';
  });
  protected readonly matcher: ErrorStateMatcher = { isErrorState: () => this.error() !== '' };
  private readonly inputField = viewChild.required(MatInput);

  private onChange: (id: string) => void = () => undefined;
  protected onTouched: () => void = () => undefined;

  constructor() {
    if (this.ngControl) this.ngControl.valueAccessor = this;
    inject(DestroyRef).onDestroy(() => this.controlEvents?.unsubscribe());
    // MatInput re-reads its error state by itself only when it has a form control of its own;
    // this input has none (the picker's host holds it), so tell it whenever the message changes.
    effect(() => {
      this.error();
      this.inputField().updateErrorState();
    });
  }

  /**
   * Follows the bound control, which a parent may swap for another (a form rebuilt for another
   * record) without telling the accessor; its events then drive the message shown.
   */
  ngDoCheck(): void {
    const control = this.ngControl?.control ?? null;
    if (control === this.control) return;
    this.controlEvents?.unsubscribe();
    this.control = control;
    this.controlEvents = control?.events.subscribe(() => this.controlChanged.update((n) => n + 1));
    this.controlChanged.update((n) => n + 1);
  }

  writeValue(id: string | null | undefined): void {
    this.id.set(id || null);
  }

  registerOnChange(fn: (id: string) => void): void {
    this.onChange = fn;
  }

  registerOnTouched(fn: () => void): void {
    this.onTouched = fn;
  }

  setDisabledState(disabled: boolean): void {
    this.disabled.set(disabled);
  }

  protected readonly nameOf = (m: MaterialListItem | string | null) =>
    typeof m === 'string' ? m : (m?.tradeName ?? '');

  protected type(value: string): void {
    this.text.set(value);
    this.active.set(true);
    // Typing over a chosen material un-chooses it, so a half-typed name is never saved.
    if (this.id()) this.select(null);
  }

  protected choose(material: MaterialListItem): void {
    this.select(material);
    this.text.set(material.tradeName);
    this.onTouched();
  }

  protected clear(): void {
    this.text.set('');
    if (this.id()) this.select(null);
  }

  private select(material: MaterialListItem | null): void {
    this.chosen.set(material);
    this.id.set(material?.id ?? null);
    this.onChange(material?.id ?? '');
    this.picked.emit(material);
  }
}
