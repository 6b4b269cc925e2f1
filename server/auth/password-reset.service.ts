import { type DataSource, IsNull } from 'typeorm';
import { runTransaction } from '../data-source';
import { ConflictError, GoneError, NotFoundError } from '../http/errors';
import type { Mailer } from '../mail/mailer';
import { passwordResetMail } from '../mail/password-reset-mail';
import { hashPassword } from '../users/password';
import { User } from '../users/user.entity';
import { PasswordReset } from './password-reset.entity';
import { createLinkToken, hashLinkToken } from './token';

export const PASSWORD_RESET_LIFETIME_ms = 2 * 60 * 60 * 1000;

export class PasswordResetService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly mailer: Mailer,
    private readonly publicUrl: string,
  ) {}

  /**
   * Self-service request. Says nothing about whether the address is registered: the caller
   * answers 202 either way, so unknown or deactivated addresses silently get no e-mail.
   */
  async requestForEmail(email: string): Promise<void> {
    const user = await this.dataSource.getRepository(User).findOneBy({ email: email.toLowerCase() });
    if (user?.active) await this.send(user, false);
  }

  /** An administrator sends the link. */
  async requestForUser(userId: string): Promise<{ expiresAt: string }> {
    const user = await this.dataSource.getRepository(User).findOneBy({ id: userId });
    if (!user) throw new NotFoundError('User not found.', { code: 'user_not_found' });
    if (!user.active) {
      throw new ConflictError('This user is deactivated. Reactivate the account before sending a reset link.', {
        code: 'user_deactivated',
      });
    }
    return this.send(user, true);
  }

  async lookup(token: string): Promise<{ email: string }> {
    const { user } = await this.findUsable(token);
    return { email: user.email };
  }

  /** Sets the password, uses up every open link of the user and ends all their sessions. */
  async complete(token: string, password: string): Promise<void> {
    const { reset } = await this.findUsable(token);
    const passwordHash = await hashPassword(password);
    await runTransaction(this.dataSource, async (manager) => {
      const fresh = await manager.findOneByOrFail(PasswordReset, { id: reset.id });
      if (fresh.usedAt) throw usedError();
      await manager.update(PasswordReset, { userId: fresh.userId, usedAt: IsNull() }, { usedAt: new Date() });
      await manager.update(User, { id: fresh.userId }, { passwordHash, sessionVersion: () => '"sessionVersion" + 1' });
    });
  }

  private async send(user: User, byAdmin: boolean): Promise<{ expiresAt: string }> {
    const { token, tokenHash } = createLinkToken();
    const expiresAt = new Date(Date.now() + PASSWORD_RESET_LIFETIME_ms);
    const resets = this.dataSource.getRepository(PasswordReset);
    const reset = await resets.save(resets.create({ userId: user.id, tokenHash, expiresAt }));
    try {
      await this.mailer.send(
        passwordResetMail({ to: user.email, name: user.name, resetUrl: `${this.publicUrl}/reset-password/${token}`, expiresAt, byAdmin }),
      );
    } catch (error) {
      await resets.delete({ id: reset.id });
      throw error;
    }
    return { expiresAt: expiresAt.toISOString() };
  }

  private async findUsable(token: string): Promise<{ reset: PasswordReset; user: User }> {
    const reset = await this.dataSource
      .getRepository(PasswordReset)
      .findOne({ where: { tokenHash: hashLinkToken(token) }, relations: { user: true } });
    if (!reset?.user) {
      throw new NotFoundError('This password-reset link is not valid. Check that you copied the whole link.', {
        code: 'reset_not_found',
      });
    }
    if (reset.usedAt) throw usedError();
    if (reset.expiresAt.getTime() <= Date.now()) {
      throw new GoneError('This password-reset link has expired. Ask for a new one.', { code: 'reset_expired' });
    }
    if (!reset.user.active) {
      throw new GoneError('This account is deactivated, so its password cannot be reset.', { code: 'account_deactivated' });
    }
    return { reset, user: reset.user };
  }
}

function usedError(): GoneError {
  return new GoneError('This password-reset link has already been used. Ask for a new one if you need to.', {
    code: 'reset_used',
  });
}
