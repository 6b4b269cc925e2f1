import { splitLinks } from './text-with-links';

describe('splitLinks', () => {
  it('finds an invitation link inside a sentence and leaves the full stop out', () => {
    expect(splitLinks('Open http://localhost:4300/invitations/abc123. It works once.')).toEqual([
      { kind: 'text', text: 'Open ' },
      { kind: 'link', href: 'http://localhost:4300/invitations/abc123' },
      { kind: 'text', text: '. It works once.' },
    ]);
  });

  it('keeps query strings and several links apart', () => {
    const parts = splitLinks('a https://x.test/r?t=1&u=2\nb http://y.test/');
    expect(parts.filter((part) => part.kind === 'link')).toEqual([
      { kind: 'link', href: 'https://x.test/r?t=1&u=2' },
      { kind: 'link', href: 'http://y.test/' },
    ]);
  });

  it('treats javascript: and other schemes as plain text', () => {
    expect(splitLinks('javascript:alert(1) ftp://z.test')).toEqual([
      { kind: 'text', text: 'javascript:alert(1) ftp://z.test' },
    ]);
  });
});
