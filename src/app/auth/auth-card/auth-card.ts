import { ChangeDetectionStrategy, Component, input } from '@angular/core';

/** The narrow centred panel the sign-in and e-mailed link pages share. */
@Component({
  selector: 'tl-auth-card',
  templateUrl: './auth-card.html',
  styleUrl: './auth-card.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AuthCard {
  readonly heading = input.required<string>();
  readonly intro = input<string>('');
}
