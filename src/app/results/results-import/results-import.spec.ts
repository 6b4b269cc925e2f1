import { HttpTestingController } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { TestBed } from '@angular/core/testing';
import { Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { CSRF_TOKEN_URL } from '../../core/csrf.interceptor';
import { nextRequest, settle } from '../../core/http.testing';
import { TEST_PROJECT_ID } from '../../core/session.testing';
import { configureProjectPagesForTests, openProjectSection } from '../../projects/project.testing';
import { ResultSet, ResultsUpload, RevisionChoice } from '../results-api';

// An invented project's revisions and an invented export: the numbers mean nothing.
const api = `/api/projects/${TEST_PROJECT_ID}`;
const revisions: RevisionChoice[] = [
  { id: 'rev-3', number: 3, fileName: 'canopy-rev-C.ifc', status: 'failed', uploadedAt: '2026-03-04T10:00:00Z' },
  { id: 'rev-2', number: 2, fileName: 'canopy-rev-B.ifc', status: 'ready', uploadedAt: '2026-03-03T10:00:00Z' },
  { id: 'rev-1', number: 1, fileName: 'canopy-rev-A.ifc', status: 'ready', uploadedAt: '2026-03-02T10:00:00Z' },
];
const csvUpload: ResultsUpload = {
  id: 'up-1',
  fileName: 'canopy-shears.csv',
  format: 'csv',
  sizeBytes: 2048,
  sha256: 'c'.repeat(64),
  sheets: null,
  sheet: null,
  delimiter: ';',
  decimalSeparator: '.',
  headerRow: 1,
  headers: ['Bar', 'Combo', 'Station [m]', 'V [kN]'],
  rows: [
    ['G-101', 'ULS-1', '0', '212.5'],
    ['G-101', 'ULS-2', '0', '198.0'],
  ],
  guessedMapping: { memberColumn: 'Bar', combinationColumn: 'Combo', stationColumn: 'Station [m]', shearColumn: 'V [kN]', forceUnit: 'kN', lengthUnit: 'm', memberKeyKind: 'auto' },
  missingMapping: [],
};

describe('ResultsImport', () => {
  let backend: HttpTestingController;
  let harness: RouterTestingHarness;
  let page: HTMLElement;

  beforeEach(async () => {
    backend = configureProjectPagesForTests();
    harness = await openProjectSection('coordinator', 'shear-results/import');
    (await nextRequest(backend, `${api}/result-mappings`)).flush({ templates: [] });
    (await nextRequest(backend, `${api}/models`)).flush({ revisions });
    await settle();
    page = harness.routeNativeElement!.querySelector<HTMLElement>('tl-results-import')!;
  });

  afterEach(() => backend.verify());

  const button = (label: string) =>
    [...page.querySelectorAll<HTMLButtonElement>('button')].find((b) => b.textContent!.replace(/\s+/g, ' ').includes(label))!;

  async function chooseFile(name: string, answer: ResultsUpload): Promise<void> {
    const input = page.querySelector<HTMLInputElement>('input[type=file]')!;
    Object.defineProperty(input, 'files', { value: [new File(['Bar;Combo\n'], name)], configurable: true });
    input.dispatchEvent(new Event('change'));
    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    const upload = await nextRequest(backend, { method: 'POST', url: `${api}/results/uploads` });
    expect((upload.request.body as FormData).get('file')).toBeInstanceOf(File);
    upload.flush({ upload: answer });
    await settle();
  }

  async function next(label: string): Promise<void> {
    button(label).click();
    await settle();
  }

  it('previews the file with the guessed mapping and imports it into the newest ready revision', async () => {
    await chooseFile('canopy-shears.csv', csvUpload);
    expect(page.textContent).toContain('(delimiter ";")');
    await next('Next: columns');

    const headerCells = [...page.querySelectorAll('.preview-table th')].map((th) => th.textContent!.replace(/\s+/g, ' ').trim());
    expect(headerCells).toEqual(['member Bar', 'combination Combo', 'station Station [m]', 'shear V [kN]']);
    expect(page.querySelectorAll('.preview-table tbody tr')).toHaveLength(2);
    expect(page.querySelector('.problems')).toBeNull();
    await next('Next: revision and name');

    const name = page.querySelector<HTMLInputElement>('input[formcontrolname=name]')!;
    expect(name.value).toBe('canopy-shears');
    button('Import').click();
    const post = await nextRequest(backend, { method: 'POST', url: `${api}/results` });
    expect(post.request.body).toEqual({
      uploadId: 'up-1',
      mapping: { memberColumn: 'Bar', memberKeyKind: 'auto', combinationColumn: 'Combo', stationColumn: 'Station [m]', shearColumn: 'V [kN]', forceUnit: 'kN', lengthUnit: 'm' },
      modelRevisionId: 'rev-2',
      name: 'canopy-shears',
    });
    post.flush({ resultSet: { id: 'set-1' } as ResultSet }, { status: 201, statusText: 'Created' });
    await settle();

    // The matching report of the new set opens.
    expect(TestBed.inject(Router).url).toBe(`/projects/${TEST_PROJECT_ID}/shear-results/set-1`);
    (await nextRequest(backend, `${api}/results/set-1`)).flush({ error: { code: 'not_found', message: 'Gone.' } }, { status: 404, statusText: 'Not Found' });
  });

  it('fills the minor-axis shear and moment columns from the detected mapping and sends them', async () => {
    // Invented export with the shear across the flanges and both moments.
    const forcesUpload: ResultsUpload = {
      ...csvUpload,
      headers: ['Bar', 'Combo', 'Vz [kN]', 'Vy [kN]', 'My [kNm]', 'Mz [kNm]'],
      rows: [['G-101', 'ULS-1', '212.5', '8.4', '95.0', '3.1']],
      guessedMapping: {
        memberColumn: 'Bar',
        combinationColumn: 'Combo',
        shearColumn: 'Vz [kN]',
        minorShearColumn: 'Vy [kN]',
        majorMomentColumn: 'My [kNm]',
        minorMomentColumn: 'Mz [kNm]',
        forceUnit: 'kN',
        momentUnit: 'kNm',
        memberKeyKind: 'auto',
      },
    };
    await chooseFile('canopy-forces.csv', forcesUpload);
    await next('Next: columns');

    const headerCells = [...page.querySelectorAll('.preview-table th')].map((th) => th.textContent!.replace(/\s+/g, ' ').trim());
    expect(headerCells).toEqual(['member Bar', 'combination Combo', 'shear Vz [kN]', 'Vy Vy [kN]', 'My My [kNm]', 'Mz Mz [kNm]']);
    const loader = TestbedHarnessEnvironment.loader(harness.fixture);
    const selected = async (label: string) =>
      (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))).getControl(MatSelectHarness))!.getValueText();
    expect(await selected('Shear across the flanges, Vy (optional)')).toBe('Vy [kN]');
    expect(await selected('Moment about the major axis, My (optional)')).toBe('My [kNm]');
    expect(await selected('Moment about the minor axis, Mz (optional)')).toBe('Mz [kNm]');
    expect(await selected('Moment unit')).toBe('kNm');
    expect(page.querySelector('.problems')).toBeNull();

    await next('Next: revision and name');
    button('Import').click();
    const post = await nextRequest(backend, { method: 'POST', url: `${api}/results` });
    expect((post.request.body as { mapping: unknown }).mapping).toEqual(forcesUpload.guessedMapping);
    post.flush({ resultSet: { id: 'set-2' } as ResultSet }, { status: 201, statusText: 'Created' });
    await settle();
    (await nextRequest(backend, `${api}/results/set-2`)).flush({ error: { code: 'not_found', message: 'Gone.' } }, { status: 404, statusText: 'Not Found' });
  });

  it('asks for the moment unit when a moment column is mapped without one', async () => {
    await chooseFile('canopy-forces.csv', {
      ...csvUpload,
      headers: ['Bar', 'Combo', 'V [kN]', 'My'],
      guessedMapping: { memberColumn: 'Bar', combinationColumn: 'Combo', shearColumn: 'V [kN]', majorMomentColumn: 'My', forceUnit: 'kN' },
      missingMapping: ['momentUnit'],
    });
    await next('Next: columns');
    const problems = [...page.querySelectorAll('.problems li')].map((li) => li.textContent!.trim());
    expect(problems).toEqual(['Choose the unit of the moment columns.']);
    expect(button('Next: revision and name').disabled).toBe(true);
  });

  it('asks which sheet of a workbook holds the shear forces before going on', async () => {
    await chooseFile('canopy.xlsx', { ...csvUpload, format: 'xlsx', delimiter: null, sheets: ['Summary', 'Shears'], sheet: null, headers: [], rows: [], guessedMapping: {} });
    expect(button('Next: columns').disabled).toBe(true);

    const loader = TestbedHarnessEnvironment.loader(harness.fixture);
    const sheet = await loader.getHarness(MatSelectHarness.with({ selector: '.sheet mat-select' }));
    await sheet.open();
    await sheet.clickOptions({ text: 'Shears' });
    const preview = await nextRequest(backend, (request) => request.url === `${api}/results/uploads/up-1/preview`);
    expect(preview.request.params.get('sheet')).toBe('Shears');
    preview.flush({ upload: { ...csvUpload, format: 'xlsx', delimiter: null, sheets: ['Summary', 'Shears'], sheet: 'Shears' } });
    await settle();
    expect(button('Next: columns').disabled).toBe(false);
  });

  it('says what the mapping still lacks', async () => {
    await chooseFile('canopy-shears.csv', { ...csvUpload, guessedMapping: { memberColumn: 'Bar', shearColumn: 'V [kN]' }, missingMapping: ['combinationColumn', 'forceUnit'] });
    await next('Next: columns');
    const problems = [...page.querySelectorAll('.problems li')].map((li) => li.textContent!.trim());
    expect(problems).toEqual(['Choose the load combination column.', 'Choose the force unit.']);
    expect(button('Next: revision and name').disabled).toBe(true);
  });

  it('lists the refused rows by row and column, and stays on the form', async () => {
    await chooseFile('canopy-shears.csv', csvUpload);
    await next('Next: columns');
    await next('Next: revision and name');
    button('Import').click();
    (await nextRequest(backend, { method: 'POST', url: `${api}/results` })).flush(
      {
        error: {
          code: 'invalid_rows',
          message: 'The file has 2 rows that cannot be imported.',
          details: {
            errors: [
              { row: 3, column: 'V [kN]', code: 'not_numeric', message: "'abc' is not a number" },
              { row: 7, column: null, code: 'duplicate_row', message: 'same member, combination and station as row 5' },
            ],
            stoppedEarly: false,
          },
        },
      },
      { status: 422, statusText: 'Unprocessable Entity' },
    );
    await settle();
    expect(page.querySelector('[role=alert]')?.textContent).toContain('2 rows that cannot be imported');
    const rows = [...page.querySelectorAll('.row-errors tbody tr')].map((tr) => [...tr.querySelectorAll('td')].map((td) => td.textContent!.trim()));
    expect(rows).toEqual([
      ['3', 'V [kN]', "'abc' is not a number"],
      ['7', '—', 'same member, combination and station as row 5'],
    ]);
    expect(harness.routeNativeElement!.querySelector('tl-results-import')).not.toBeNull();
  });
});
