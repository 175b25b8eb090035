import {
  ChangeDetectionStrategy,
  Component,
  computed,
  inject,
  input,
  signal,
  untracked,
} from '@angular/core';
import { type FormControl, NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import { type ProductIdentity, productIdentitySchema, ROLE_SETS } from '@batchproof/shared';
import { Session } from '../../auth/session';
import { focusFragment } from '../../forms/focus-fragment';
import { errorMessage, validateForm } from '../../forms/form-errors';
import { sendForm } from '../../forms/send-form';
import { type LeavesSafely, warnBeforeUnload } from '../../forms/unsaved-changes';
import { messageOf } from '../../http/api-error';
import { FormulasApi } from '../../formulas/formulas-api';
import { LabelDetailsApi } from '../label-details-api';
import { IDENTITY_SECTIONS } from './identity-sections';

/**
 * A formula's product identity: what its labels carry beyond the engine's declaration, warnings
 * and net quantity. Every input's id is its contract path, so a refused print run links straight
 * to the field (`#euResponsiblePerson.address`). The owner and formulators edit; others read.
 */
@Component({
  selector: 'bp-product-identity-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatProgressBar,
  ],
  templateUrl: './product-identity-page.html',
  styleUrl: './product-identity-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export default class ProductIdentityPage implements LeavesSafely {
  /** The formula's id, from the path. */
  readonly id = input.required<string>();

  private readonly api = inject(LabelDetailsApi);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly snackBar = inject(MatSnackBar);
  private readonly session = inject(Session);
  protected readonly sections = IDENTITY_SECTIONS;
  protected readonly errorMessage = errorMessage;
  protected readonly canWrite = computed(() => this.session.hasRole(ROLE_SETS.writers));

  protected readonly formula = inject(FormulasApi).formula(() => this.id());
  protected readonly identity = this.api.identity(() => this.id());
  protected readonly saving = signal(false);
  protected readonly notice = signal('');
  private readonly state = { sending: this.saving, notice: this.notice };
  protected readonly loadError = computed(() => {
    const error = this.identity.error() ?? this.formula.error();
    return error ? messageOf(error) : '';
  });

  /** The form, built once the identity is read (empty fields until one is entered). */
  protected readonly form = computed(() => {
    if (!this.identity.hasValue()) return undefined;
    const identity = this.identity.value().identity;
    return untracked(() => {
      const form = this.build(identity);
      if (!this.canWrite()) form.disable();
      return form;
    });
  });

  constructor() {
    focusFragment(computed(() => this.form() !== undefined));
    warnBeforeUnload(() => this.hasUnsavedChanges());
  }

  private build(i: ProductIdentity | null) {
    const fb = this.fb;
    const text = (v: string | null | undefined) => v ?? '';
    return fb.group({
      productName: text(i?.productName),
      productCode: text(i?.productCode),
      gtin: text(i?.gtin),
      shelfLifeMonths: fb.control<number | null>(i?.shelfLifeMonths ?? null),
      periodAfterOpeningMonths: fb.control<number | null>(i?.periodAfterOpeningMonths ?? null),
      directions: text(i?.directions),
      usAdverseEventContact: fb.group({
        address: text(i?.usAdverseEventContact.address),
        phone: text(i?.usAdverseEventContact.phone),
        website: text(i?.usAdverseEventContact.website),
      }),
      euResponsiblePerson: fb.group({
        name: text(i?.euResponsiblePerson.name),
        address: text(i?.euResponsiblePerson.address),
      }),
      ukResponsiblePerson: fb.group({
        name: text(i?.ukResponsiblePerson.name),
        address: text(i?.ukResponsiblePerson.address),
      }),
      canadianFrench: fb.group({
        productName: text(i?.canadianFrench.productName),
        warnings: text(i?.canadianFrench.warnings),
        directions: text(i?.canadianFrench.directions),
      }),
    });
  }

  /** The control at a contract path (every path in {@link IDENTITY_SECTIONS} exists). */
  protected control(path: string): FormControl {
    return this.form()!.get(path) as FormControl;
  }

  hasUnsavedChanges(): boolean {
    return this.canWrite() && !!this.form()?.dirty;
  }

  saveChanges(): Promise<boolean> {
    return this.save();
  }

  /** Checks the form with the shared schema and saves it; resolves whether it was saved. */
  async save(): Promise<boolean> {
    const form = this.form();
    if (!form || this.saving()) return false;
    this.notice.set('');
    const value = validateForm(form, productIdentitySchema);
    if (!value) {
      this.notice.set('Some fields need attention; each says why below it.');
      return false;
    }
    const saved = await sendForm(form, this.api.saveIdentity(this.id(), value), this.state);
    if (saved) this.snackBar.open('The product identity is saved.', 'OK', { duration: 4000 });
    return saved !== null;
  }
}
