import { ChangeDetectionStrategy, Component, inject, output, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect, MatSelectTrigger } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import {
  type Invitation,
  invitationCreateSchema,
  ROLE_DESCRIPTIONS,
  ROLES,
  type Role,
} from '@batchproof/shared';
import { errorMessage, showRequestError, validateForm } from '../../forms/form-errors';
import { MembersApi } from '../members-api';

/** The owner's form for inviting someone by e-mail with a role. */
@Component({
  selector: 'bp-invite-form',
  imports: [
    ReactiveFormsModule,
    MatButton,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatOption,
    MatProgressBar,
    MatSelect,
    MatSelectTrigger,
  ],
  templateUrl: './invite-form.html',
  styleUrl: './invite-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InviteForm {
  /** Emits each invitation once the API has sent its e-mail. */
  readonly invited = output<Invitation>();

  private readonly api = inject(MembersApi);
  private readonly snackBar = inject(MatSnackBar);
  protected readonly form = inject(NonNullableFormBuilder).group({
    email: '',
    role: 'formulator' as Role,
  });
  protected readonly roles = ROLES;
  protected readonly descriptions = ROLE_DESCRIPTIONS;
  protected readonly role = toSignal(this.form.controls.role.valueChanges, {
    initialValue: this.form.controls.role.value,
  });
  protected readonly submitting = signal(false);
  protected readonly notice = signal('');
  protected readonly errorMessage = errorMessage;

  protected submit(): void {
    if (this.submitting()) return;
    this.notice.set('');
    const value = validateForm(this.form, invitationCreateSchema);
    if (!value) return;
    this.submitting.set(true);
    this.api.invite(value).subscribe({
      next: (invitation) => {
        this.submitting.set(false);
        this.form.reset();
        const replaced = invitation.replaced
          ? ' It replaces the earlier invitation, whose link no longer works.'
          : '';
        this.snackBar.open(`Invitation sent to ${invitation.email}.${replaced}`, 'OK', {
          duration: 5000,
        });
        this.invited.emit(invitation);
      },
      error: (err: unknown) => {
        this.submitting.set(false);
        this.notice.set(showRequestError(this.form, err));
      },
    });
  }
}
