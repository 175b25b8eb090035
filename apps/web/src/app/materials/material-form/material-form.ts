import { COMMA, ENTER } from '@angular/cdk/keycodes';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  output,
  signal,
} from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatCheckbox } from '@angular/material/checkbox';
import {
  MatChipGrid,
  MatChipInput,
  type MatChipInputEvent,
  MatChipRemove,
  MatChipRow,
} from '@angular/material/chips';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import {
  isScentCategory,
  type Material,
  materialCreateSchema,
  ROLE_SETS,
} from '@batchproof/shared';
import { Session } from '../../auth/session';
import { checkForm, errorMessage, showRequestError } from '../../forms/form-errors';
import { SuppliersApi } from '../../suppliers/suppliers-api';
import { AllergenDeclarationEditor } from '../allergen-declaration-editor/allergen-declaration-editor';
import { BlendEditor } from '../blend-editor/blend-editor';
import { IfraCertificateEditor } from '../ifra-certificate-editor/ifra-certificate-editor';
import { CATEGORY_OPTIONS } from '../material-labels';
import { MaterialsApi } from '../materials-api';
import { WeightPerVolumeEditor } from '../weight-per-volume-editor/weight-per-volume-editor';
import { formChanges } from './form-changes';
import {
  materialFormPath,
  MaterialFormModel,
  rowErrors,
  toMaterialInput,
} from './material-form-model';

/**
 * Everything about one material: identity, Colour Index, blend components, the fragrance
 * certificate and allergen declaration, and weight per volume. Checked with the shared schema
 * before it is sent; the server's messages land beside their fields and nothing typed is lost.
 * Read-only for members who may not write.
 */
@Component({
  selector: 'bp-material-form',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatCheckbox,
    MatChipGrid,
    MatChipInput,
    MatChipRemove,
    MatChipRow,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatProgressBar,
    MatSelect,
    AllergenDeclarationEditor,
    BlendEditor,
    IfraCertificateEditor,
    WeightPerVolumeEditor,
  ],
  templateUrl: './material-form.html',
  styleUrl: './material-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaterialForm {
  /** The material to edit, or null for a new one. */
  readonly material = input<Material | null>(null);
  /** Emits the material as the API stored it after each save. */
  readonly saved = output<Material>();

  private readonly api = inject(MaterialsApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly session = inject(Session);
  private readonly model = new MaterialFormModel(inject(NonNullableFormBuilder));

  /** Whether the signed-in member may change materials. */
  protected readonly canWrite = computed(() => this.session.hasRole(ROLE_SETS.writers));
  /** The form, built once per material shown; disabled for readers. */
  protected readonly form = computed(() => {
    const form = this.model.form(this.material());
    if (!this.canWrite()) form.disable();
    return form;
  });
  private readonly changes = formChanges(this.form);
  protected readonly value = computed(() => {
    this.changes();
    return this.form().getRawValue();
  });
  protected readonly isScent = computed(() => {
    const category = this.value().category;
    return category !== '' && isScentCategory(category);
  });
  protected readonly showColourIndex = computed(
    () => this.value().category === 'colourant' || this.value().colourIndex !== '',
  );
  private readonly supplierList = inject(SuppliersApi).options();
  /** Suppliers to pick from, including the material's own when it is beyond the first page. */
  protected readonly suppliers = computed(() => {
    const list = this.supplierList.hasValue() ? this.supplierList.value() : [];
    const m = this.material();
    const own = m?.supplierId && !list.some((s) => s.id === m.supplierId);
    return own
      ? [{ id: m.supplierId!, name: m.supplierName ?? 'Current supplier' }, ...list]
      : list;
  });
  /** The API's calibration summary, refreshed on every save. */
  protected readonly summary = signal<Material['calibrationSummary'] | null>(null);
  protected readonly currentSummary = computed(
    () => this.summary() ?? this.material()?.calibrationSummary ?? [],
  );
  protected readonly categories = CATEGORY_OPTIONS;
  protected readonly separators = [ENTER, COMMA] as const;
  protected readonly errorMessage = errorMessage;
  protected readonly saving = signal(false);
  protected readonly notice = signal('');

  protected addFunction(event: MatChipInputEvent): void {
    const name = event.value.trim();
    const control = this.form().controls.functions;
    if (name && !control.value.includes(name)) {
      control.setValue([...control.value, name]);
      control.markAsDirty();
    }
    event.chipInput.clear();
  }

  protected removeFunction(name: string): void {
    const control = this.form().controls.functions;
    control.setValue(control.value.filter((f) => f !== name));
    control.markAsDirty();
  }

  /** Whether the form holds changes not saved yet. */
  hasUnsavedChanges(): boolean {
    return this.canWrite() && this.form().dirty;
  }

  /** Checks and saves the material; resolves whether it was saved. */
  save(): Promise<boolean> {
    if (this.saving() || !this.canWrite()) return Promise.resolve(false);
    this.notice.set('');
    const form = this.form();
    const raw = form.getRawValue();
    const mapPath = materialFormPath(raw);
    const input = toMaterialInput(raw);
    const checked = checkForm(form, {
      schema: materialCreateSchema,
      body: input,
      extra: rowErrors(raw),
      mapPath,
    });
    if (!checked.value) {
      this.notice.set(['Some fields need attention.', checked.notice].filter(Boolean).join(' '));
      return Promise.resolve(false);
    }
    this.saving.set(true);
    const id = this.material()?.id;
    return new Promise((resolve) => {
      (id ? this.api.update(id, input) : this.api.create(input)).subscribe({
        next: (material) => {
          this.saving.set(false);
          this.summary.set(material.calibrationSummary);
          form.markAsPristine();
          this.snackBar.open(`Saved ${material.tradeName}.`, 'OK', { duration: 4000 });
          this.saved.emit(material);
          resolve(true);
        },
        error: (err: unknown) => {
          this.saving.set(false);
          this.notice.set(showRequestError(form, err, mapPath));
          resolve(false);
        },
      });
    });
  }
}
