import { mentionedMembers } from './finding-mentions';

// Invented people for the mention rules (common practice for chat-style mentions, no source).
const members = [
  { id: 'a', email: 'esme.varga@example.test', name: 'Esme Varga' },
  { id: 'b', email: 'ann@example.test', name: 'Ann' },
  { id: 'c', email: 'anna@example.test', name: 'Anna' },
];

describe('mentionedMembers', () => {
  it('finds members by address or by full name, ignoring case', () => {
    expect(mentionedMembers('@ESME.VARGA@example.test please check', members).map((m) => m.id)).toEqual(['a']);
    expect(mentionedMembers('Thanks @esme varga.', members).map((m) => m.id)).toEqual(['a']);
  });

  it('does not take a longer name for a shorter one', () => {
    expect(mentionedMembers('@Anna, see the notch', members).map((m) => m.id)).toEqual(['c']);
    expect(mentionedMembers('@Ann: see the notch', members).map((m) => m.id)).toEqual(['b']);
  });

  it('lists each member once and needs the @', () => {
    expect(mentionedMembers('@Ann and @ann@example.test again', members).map((m) => m.id)).toEqual(['b']);
    expect(mentionedMembers('Ann and Esme Varga', members)).toEqual([]);
  });
});
