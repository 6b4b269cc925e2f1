import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { CAUTION_SUMMARY, CAUTIONS } from '../../src/app/core/cautions';
import { REPORT_CAUTIONS_TEXT, REPORT_CAUTIONS } from './report-cautions';

const ROOT = path.resolve(__dirname, '../..');

/** Source files under server/ and src/ (not specs), with string concatenations joined and spaces collapsed. */
function sourceTexts(): { file: string; text: string }[] {
  const files = ['server', 'src'].flatMap((dir) =>
    readdirSync(path.join(ROOT, dir), { recursive: true, encoding: 'utf8' })
      .filter((file) => /\.(ts|html)$/.test(file) && !file.endsWith('.spec.ts'))
      .map((file) => path.join(dir, file)),
  );
  return files.map((file) => ({
    file: file.split(path.sep).join('/'),
    text: readFileSync(path.join(ROOT, file), 'utf8')
      .replace(/['"`]\s*\+\s*['"`]/g, '')
      .replace(/\\u2019|’/g, "'")
      .replace(/\s+/g, ' '),
  }));
}

describe('report cautions', () => {
  it('are the sentences the client shows, and the same words as the footer paragraph', () => {
    expect(REPORT_CAUTIONS).toEqual(CAUTIONS);
    expect(REPORT_CAUTIONS.join(' ')).toBe(REPORT_CAUTIONS_TEXT.replace('; verify', '. Verify'));
  });

  // What a checking aid must tell its users (common practice, no source): what the results depend on, that they are
  // no design, who decides (local code, national annex, engineer of record), and what this web-shear check leaves out.
  it.each([
    ['the inputs the results depend on', /imported forces.*section data.*chosen parameters/],
    ['that they are an aid for qualified engineers, not a design', /checking aid for qualified engineers, not a design/],
    ['the governing local building code', /governing local building code/],
    ['its national annex', /national annex/],
    ['the engineer of record', /engineer of record/],
    ['connections', /connections/],
    ['coped ends', /coped ends/],
    ['concentrated loads', /concentrated loads/],
    ['fatigue', /fatigue/],
    ['combined actions', /combined actions/],
  ])('name %s', (_what, words) => {
    expect(REPORT_CAUTIONS_TEXT).toMatch(words);
  });

  it('are summed up in the client by deferring to the local code and the engineer of record', () => {
    expect(CAUTION_SUMMARY).toMatch(/not a design/);
    expect(CAUTION_SUMMARY).toMatch(/local code/);
    expect(CAUTION_SUMMARY).toMatch(/engineer of record/);
  });

  // Reports, exports, the command line and the start-up banner import the text (their specs check what they print);
  // a second copy would drift from it unseen.
  it('are written out only in report-cautions.ts and the client list it is compared with', () => {
    const fragments = ['checking aid for qualified engineers', 'its national annex and the engineer of record', 'coped ends, concentrated loads'];
    const copies = sourceTexts()
      .filter(({ text }) => fragments.some((fragment) => text.includes(fragment)))
      .map(({ file }) => file);
    expect(copies.sort()).toEqual(['server/reports/report-cautions.ts', 'src/app/core/cautions.ts']);
  });
});
