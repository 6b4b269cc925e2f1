import { mmText, progressText, revisionLabel, sizeText } from './model-words';

describe('model words', () => {
  it('tells the phase and the share done while a revision is read', () => {
    expect(progressText({ status: 'ingesting', progress: { phase: 'geometry', fraction: 0.629 } })).toBe('Building the 3D geometry · 62 %');
    expect(progressText({ status: 'queued', progress: null })).toBe('Waiting to be read');
    expect(progressText({ status: 'ingesting', progress: { phase: 'later-phase', fraction: 0.5 } })).toBe('Reading · 50 %');
  });

  it('writes sizes in binary units (1 KB = 1024 bytes, common practice, no source)', () => {
    expect(sizeText(512)).toBe('512 B');
    expect(sizeText(307_807)).toBe('301 KB');
    expect(sizeText(16_473_528)).toBe('15.7 MB');
    expect(sizeText(2 * 1024 ** 3)).toBe('2.00 GB');
  });

  it('writes millimetres with one decimal at most, and a dash for nothing', () => {
    expect(mmText(5.6)).toBe('5.6');
    expect(mmText(303.45)).toBe('303.5');
    expect(mmText(6000)).toBe('6,000');
    expect(mmText(null)).toBe('—');
  });

  it('names a revision by number and file', () => {
    expect(revisionLabel({ number: 3, fileName: 'frame-rev-C.ifc' })).toBe('Revision 3 · frame-rev-C.ifc');
  });
});
