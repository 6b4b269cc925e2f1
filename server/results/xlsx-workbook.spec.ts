import { zipOf } from '../../test/fixtures/bcf/hostile-archives';
import { type TempFiles, tempFiles } from '../../test/fixtures/results/result-files';
import { ResultsFileError } from './results-file-error';
import { listXlsxSheets } from './xlsx-workbook';

// The two parts the sheet list is read from, as a spreadsheet program writes them (ECMA-376 Part 1, SpreadsheetML).
const WORKBOOK_XML = `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>
<workbook xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships"><sheets><sheet name="Shear" sheetId="1" r:id="rId1"/></sheets></workbook>`;
const RELS_XML = `<?xml version="1.0" encoding="UTF-8" standalone="yes"?>
<Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships"><Relationship Id="rId1" Type="http://schemas.openxmlformats.org/officeDocument/2006/relationships/worksheet" Target="worksheets/sheet1.xml"/></Relationships>`;

describe('listXlsxSheets', () => {
  let files: TempFiles;
  beforeAll(() => (files = tempFiles()));
  afterAll(() => files.remove());

  async function workbookWith(name: string, workbookXml: string): Promise<string> {
    const zip = await zipOf([
      { name: 'xl/workbook.xml', contents: workbookXml },
      { name: 'xl/_rels/workbook.xml.rels', contents: RELS_XML },
    ]);
    return files.write(name, zip);
  }

  it('lists the sheets of an ordinary workbook', async () => {
    expect(await listXlsxSheets(await workbookWith('plain.xlsx', WORKBOOK_XML))).toEqual([{ name: 'Shear', part: 'xl/worksheets/sheet1.xml' }]);
  });

  // Spreadsheet programs write no DOCTYPE in these parts (common practice, no source), so one is refused as an
  // unreadable workbook instead of being parsed.
  it.each([
    ['an internal entity', '<!DOCTYPE workbook [<!ENTITY x "Shear">]>'],
    ['nested entities', '<!DOCTYPE workbook [<!ENTITY a "aaaaaaaaaa"><!ENTITY b "&a;&a;&a;&a;&a;&a;&a;&a;&a;&a;">]>'],
    ['an external entity', '<!DOCTYPE workbook [<!ENTITY x SYSTEM "file:///etc/passwd">]>'],
    ['a malformed declaration', '<!DOCTYPE workbook [<!ENTITY'],
  ])('refuses a workbook.xml with a DOCTYPE (%s) as an unreadable workbook', async (_title, doctype) => {
    const file = await workbookWith('doctype.xlsx', WORKBOOK_XML.replace(/(\?>)/, `$1${doctype}`));
    const error = await listXlsxSheets(file).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ResultsFileError);
    expect(error).toMatchObject({ code: 'unreadable_xlsx' });
  });
});
