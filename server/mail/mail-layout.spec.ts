import { invitationMail } from './invitation-mail';
import { escapeHtml, formatUtc } from './mail-layout';
import { passwordResetMail } from './password-reset-mail';

describe('mail layout', () => {
  it('escapes HTML special characters', () => {
    expect(escapeHtml(`<a href="x">Tom & Jo's</a>`)).toBe('&lt;a href=&quot;x&quot;&gt;Tom &amp; Jo&#39;s&lt;/a&gt;');
  });

  it('writes dates in UTC to the minute', () => {
    expect(formatUtc(new Date('2026-12-08T21:05:59.999Z'))).toBe('2026-12-08 21:05 UTC');
  });

  it('renders an invitation with its link in text and HTML, escaping names', () => {
    const mail = invitationMail({
      to: 'new@example.test',
      inviteeName: 'Ana <b>',
      inviterName: 'Corin',
      project: { name: 'Depot & Offices', role: 'engineer' },
      acceptUrl: 'http://taulens.test/invitations/abc_DEF-123',
      expiresAt: new Date('2026-12-08T21:05:00Z'),
      hasAccount: false,
    });
    expect(mail.subject).toBe('You are invited to Depot & Offices on Taulens');
    expect(mail.text).toContain('Accept the invitation: http://taulens.test/invitations/abc_DEF-123');
    expect(mail.text).toContain('as engineer in the project “Depot & Offices”');
    expect(mail.text).toContain('expires on 2026-12-08 21:05 UTC');
    expect(mail.html).toContain('href="http://taulens.test/invitations/abc_DEF-123"');
    expect(mail.html).toContain('Hello Ana &lt;b&gt;,');
    expect(mail.html).not.toContain('<b>');
  });

  it('asks the holder of an existing account to sign in and join, not to create an account', () => {
    const input = { to: 'known@example.test', inviteeName: '', inviterName: 'Corin', project: { name: 'Depot', role: 'reviewer' } };
    const mail = invitationMail({ ...input, acceptUrl: 'http://taulens.test/invitations/x', expiresAt: new Date(), hasAccount: true });
    expect(mail.text).toContain('sign in to join');
    expect(mail.text).not.toContain('create your account');
  });

  it('says who asked for a password reset', () => {
    const input = { to: 'u@example.test', name: 'U', resetUrl: 'http://taulens.test/reset-password/t', expiresAt: new Date() };
    expect(passwordResetMail({ ...input, byAdmin: true }).text).toContain('An administrator asked');
    expect(passwordResetMail({ ...input, byAdmin: false }).text).toContain('Someone (hopefully you)');
  });
});
