import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { NewPasswordForm, PASSWORD_MIN_LENGTH } from '../password-rules';

/** A new password typed twice, with the server's length rules explained. */
@Component({
  selector: 'tl-new-password-fields',
  imports: [ReactiveFormsModule, MatFormFieldModule, MatInputModule],
  templateUrl: './new-password-fields.html',
  styleUrl: './new-password-fields.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NewPasswordFields {
  readonly form = input.required<NewPasswordForm>();
  protected readonly minLength = PASSWORD_MIN_LENGTH;
}
