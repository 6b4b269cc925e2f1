import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { RouterLink } from '@angular/router';
import { errorMessage } from '../../core/api-error';
import { AuthApi } from '../auth-api';
import { AuthCard } from '../auth-card/auth-card';

/** Asks for a reset link by e-mail; never tells whether the address has an account. */
@Component({
  selector: 'tl-reset-password-request',
  imports: [ReactiveFormsModule, RouterLink, MatButtonModule, MatFormFieldModule, MatInputModule, AuthCard],
  templateUrl: './reset-password-request.html',
  styleUrl: './reset-password-request.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ResetPasswordRequest {
  private readonly api = inject(AuthApi);

  protected readonly form = new FormGroup({
    email: new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.email] }),
  });
  protected readonly sending = signal(false);
  protected readonly sentTo = signal<string | null>(null);
  protected readonly failure = signal<string | null>(null);

  protected requestLink(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const email = this.form.getRawValue().email.trim();
    this.sending.set(true);
    this.failure.set(null);
    this.api.requestPasswordReset(email).subscribe({
      next: () => {
        this.sending.set(false);
        this.sentTo.set(email);
      },
      error: (error: unknown) => {
        this.sending.set(false);
        this.failure.set(errorMessage(error));
      },
    });
  }
}
