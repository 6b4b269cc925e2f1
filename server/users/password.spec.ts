import { newPasswordSchema } from './password';

function problemsOf(password: string): string[] {
  const result = newPasswordSchema.safeParse(password);
  return result.success ? [] : result.error.issues.map((issue) => issue.message);
}

describe('newPasswordSchema', () => {
  it('accepts a long password of the user’s own', () => {
    expect(problemsOf('gantry crane rail 7 bays')).toEqual([]);
    expect(problemsOf('Stahlträger-über-dem-Fluss')).toEqual([]);
  });

  it('keeps the 10-character minimum', () => {
    expect(problemsOf('short9pw!')).toEqual(['must be at least 10 characters']);
    expect(problemsOf('password')).toEqual(['must be at least 10 characters']);
    expect(problemsOf('   ')).toEqual(['must be at least 10 characters']);
  });

  it.each([' '.repeat(10), '\t\t\t\t\t     ', '\u00a0'.repeat(12)])('refuses a password of whitespace only (%j)', (password) => {
    expect(problemsOf(password)).toEqual(['must not be only spaces']);
  });

  // Entries of the common-password list shipped by @zxcvbn-ts/language-common (passwords-common), which is drawn
  // from leaked-password corpora; checked without regard to case or surrounding spaces.
  it.each(['qwertyuiop', '1234567890', 'password123', 'Basketball', 'PASSWORD123', ' 1q2w3e4r5t '])(
    'refuses the common password %j',
    (password) => {
      expect(problemsOf(password)).toEqual(['is one of the most common passwords; choose another']);
    },
  );

  it('keeps the 72-byte limit of bcrypt', () => {
    expect(problemsOf('ü'.repeat(37))).toEqual(['must be at most 72 bytes (72 plain letters)']);
  });
});
