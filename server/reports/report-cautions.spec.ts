import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { CAUTIONS } from '../../src/app/core/cautions';
import { REPORT_CAUTIONS_TEXT, REPORT_CAUTIONS } from './report-cautions';

describe('report cautions', () => {
  it('are the sentences the client shows, and the same words as the footer paragraph', () => {
    expect(REPORT_CAUTIONS).toEqual(CAUTIONS);
    expect(REPORT_CAUTIONS.join(' ')).toBe(REPORT_CAUTIONS_TEXT.replace('; verify', '. Verify'));
  });

  it('are the cautions of the product brief, word for word', () => {
    const brief = path.resolve(__dirname, '../../../shared/design/PRODUCT.md');
    if (!existsSync(brief)) throw new Error(`The product brief is not at ${brief}; the shared design folder is missing.`);
    const section = /## Cautions[^\n]*\n([\s\S]*?)\n## /.exec(readFileSync(brief, 'utf8'))?.[1] ?? '';
    expect(section.replace(/\s+/g, ' ').trim()).toBe(REPORT_CAUTIONS_TEXT);
  });
});
