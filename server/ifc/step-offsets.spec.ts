import { StepOffsets } from './step-offsets';

// Instances per ISO 10303-21: '#id=' at the start of a statement; ';' ends it; strings in apostrophes ('' inside);
// comments /* … */. Everything else that looks like an instance must not be taken for one.
const TEXT = [
  'ISO-10303-21;',
  "HEADER;FILE_NAME('a;#9=b','',(''),(''),'','','');ENDSEC;",
  'DATA;',
  "#1= IFCPERSON($,'O''Brien; #90=not an instance',$,$,$,$,$,$);",
  '/* #91= inside a comment; */ #2=IFCORGANIZATION($,\'x\',$,$,$);',
  '#3 = IFCDIRECTION((1.,0.,0.)); #4=IFCDIRECTION(',
  '(0.,1.,0.));',
  "#123456=IFCLABEL('/*not a comment*/');#7=IFCX(#1);",
  'ENDSEC;END-ISO-10303-21;',
].join('\n');
const bytes = new TextEncoder().encode(TEXT);

function expectInstances(offsets: StepOffsets): void {
  for (const [id, marker] of [[1, '#1='], [2, '#2='], [3, '#3 ='], [4, '#4='], [123456, '#123456='], [7, '#7=']] as const) {
    expect([id, offsets.offsetOf(id)]).toEqual([id, TEXT.indexOf(marker)]);
  }
  for (const notAnInstance of [9, 90, 91, 5]) expect(offsets.offsetOf(notAnInstance)).toBeUndefined();
}

describe('StepOffsets', () => {
  it('finds every instance and nothing inside strings, comments or the header', () => {
    const offsets = new StepOffsets();
    offsets.scan(bytes, 0);
    expectInstances(offsets);
  });

  it('gives the same answer whatever the chunk boundaries', () => {
    for (const size of [1, 2, 3, 7, 64]) {
      const offsets = new StepOffsets();
      for (let at = 0; at < bytes.length; at += size) offsets.scan(bytes.subarray(at, at + size), at);
      expectInstances(offsets);
    }
  });

  it('keeps far-off ids without a huge array', () => {
    const far = new TextEncoder().encode('#999999999=IFCX();');
    const offsets = new StepOffsets();
    offsets.scan(far, 0);
    expect(offsets.offsetOf(999999999)).toBe(0);
  });
});
