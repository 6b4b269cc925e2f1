import type { Logger } from 'pino';
import type { PasswordResetService } from './password-reset.service';

/** More waiting requests than this means the mail server is down or someone is flooding us; newer ones are dropped. */
const MAX_WAITING = 1000;

/**
 * Self-service reset requests, handled one after another behind the answer: the request is answered at once whether
 * or not the address has an account, so its timing says nothing about accounts. Failures are only logged.
 */
export class ResetRequestQueue {
  private tail: Promise<void> = Promise.resolve();
  private waiting = 0;

  constructor(
    private readonly resets: PasswordResetService,
    private readonly logger: Logger,
  ) {}

  enqueue(email: string): void {
    if (this.waiting >= MAX_WAITING) {
      this.logger.warn('password-reset request dropped: too many waiting');
      return;
    }
    this.waiting++;
    this.tail = this.tail
      .then(() => this.resets.requestForEmail(email))
      .catch((error: unknown) => this.logger.error({ err: error }, 'password-reset e-mail failed'))
      .finally(() => this.waiting--);
  }
}
