import { AbstractControl, FormControl, FormGroup, ValidationErrors } from '@angular/forms';

/**
 * The server's rules (server/users/password.ts): bcrypt reads only the first 72 bytes. The list of common passwords is
 * checked by the server only, which names the problem in its answer.
 */
export const PASSWORD_MIN_LENGTH = 10;
export const PASSWORD_MAX_BYTES = 72;

export function newPasswordValidator(control: AbstractControl<string>): ValidationErrors | null {
  const password = control.value ?? '';
  if (password.length < PASSWORD_MIN_LENGTH) return { tooShort: true };
  if (password.trim() === '') return { onlySpaces: true };
  if (new TextEncoder().encode(password).length > PASSWORD_MAX_BYTES) return { tooLong: true };
  return null;
}

export type NewPasswordForm = FormGroup<{
  password: FormControl<string>;
  repeat: FormControl<string>;
}>;

function repeatMatches(group: AbstractControl): ValidationErrors | null {
  const { password, repeat } = (group as NewPasswordForm).getRawValue();
  return password === repeat ? null : { mismatch: true };
}

export function createNewPasswordForm(): NewPasswordForm {
  return new FormGroup(
    {
      password: new FormControl('', { nonNullable: true, validators: [newPasswordValidator] }),
      repeat: new FormControl('', { nonNullable: true }),
    },
    { validators: [repeatMatches] },
  );
}
