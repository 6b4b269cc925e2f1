import { createNewPasswordForm } from './password-rules';

describe('new password form', () => {
  function formWith(password: string, repeat = password) {
    const form = createNewPasswordForm();
    form.setValue({ password, repeat });
    return form;
  }

  it('accepts ten characters typed twice', () => {
    expect(formWith('abcdefghij').valid).toBe(true);
  });

  it('rejects nine characters', () => {
    expect(formWith('abcdefghi').controls.password.hasError('tooShort')).toBe(true);
  });

  it('rejects ten spaces', () => {
    expect(formWith(' '.repeat(10)).controls.password.hasError('onlySpaces')).toBe(true);
  });

  it('counts bytes, not letters, against the 72-byte limit', () => {
    // 36 "é" are 36 letters but 72 UTF-8 bytes; one more goes over.
    expect(formWith('é'.repeat(36)).valid).toBe(true);
    expect(formWith('é'.repeat(37)).controls.password.hasError('tooLong')).toBe(true);
  });

  it('rejects a repeat that differs', () => {
    expect(formWith('abcdefghij', 'abcdefghik').hasError('mismatch')).toBe(true);
  });
});
