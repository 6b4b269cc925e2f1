import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import ExcelJS from 'exceljs';
import { dispatch } from '../../server/cli/main';
import type { MemberRecord } from '../../server/ifc/model-read-result';
import { ResultKey } from '../../server/results/result-key.entity';
import { ResultSet } from '../../server/results/result-set.entity';
import { ResultsUpload } from '../../server/results/results-upload.entity';
import { removeStaleUploads } from '../../server/results/stale-uploads';
import type { ApiAgent } from '../fixtures/api-agent';
import { fixturePath, SHEET_PER_COMBINATION, tempFiles } from '../fixtures/results/result-files';
import { type TestApp, startTestApp } from '../fixtures/test-app';
import { type TestTeam, createTeam } from '../fixtures/test-accounts';
import { buildingSmartSample } from '../fixtures/ifc/buildingsmart-samples';
import { generateFrame } from '../generator/generate-frame';
import {
  DEFAULT_MAPPING,
  type Revision,
  importResults,
  ingestModel,
  mappingsUrl,
  membersOf,
  resultsCsv,
  resultsFootprint,
  resultsUrl,
  storedResultFiles,
  uploadResults,
} from './results-scene';

const sha256 = (bytes: string | Buffer): string => createHash('sha256').update(bytes).digest('hex');

async function workbook(sheets: Record<string, ExcelJS.CellValue[][]>): Promise<Buffer> {
  const book = new ExcelJS.Workbook();
  for (const [name, rows] of Object.entries(sheets)) book.addWorksheet(name).addRows(rows);
  return Buffer.from(await book.xlsx.writeBuffer());
}

/**
 * Shear results through the API against a model ingested by the real server: a generated frame of our invented
 * scenario (test/generator) whose members are matched by Tag and GlobalId.
 */
describe('shear results', () => {
  let app: TestApp;
  let team: TestTeam;
  let coordinator: ApiAgent;
  let revision: Revision;
  let members: MemberRecord[];
  let projectId: string;

  beforeAll(async () => {
    app = await startTestApp();
    team = await createTeam(app.dataSource);
    projectId = team.project.id;
    coordinator = await app.signIn(team.coordinator);
    revision = await ingestModel(coordinator, projectId, generateFrame({ members: 40, fileName: 'frame-rev-A.ifc' }), 'frame-rev-A.ifc');
    members = await membersOf(app, revision.id);
  });
  afterAll(() => app.close());

  /** Two combinations per member, keyed by Tag. */
  const frameResults = () => resultsCsv(members.flatMap((member, i) => [[member.tag!, 'ULS-1', 40 + i] as const, [member.tag!, 'ULS-2', -(20 + i)] as const]));

  describe('POST /api/projects/:projectId/results/uploads', () => {
    it('previews a CSV of the default format, guesses the mapping and keeps the file', async () => {
      const content = readFileSync(fixturePath('default-format.csv'));
      const response = await uploadResults(coordinator, projectId, content, 'default-format.csv').expect(201);
      const upload = response.body.upload;
      expect(upload).toMatchObject({
        fileName: 'default-format.csv',
        format: 'csv',
        sheets: null,
        sheet: null,
        delimiter: ',',
        decimalSeparator: '.',
        headerRow: 1,
        headers: ['member', 'combination', 'station', 'shear'],
        sha256: sha256(content),
        sizeBytes: content.length,
        guessedMapping: { memberColumn: 'member', combinationColumn: 'combination', stationColumn: 'station', shearColumn: 'shear' },
        missingMapping: ['forceUnit', 'lengthUnit'],
      });
      expect(upload.rows[0]).toEqual(['2Xq$9bTgT0uPq4u1dVc3Lk', 'ULS-1', '0', '-152.5']);
      expect(storedResultFiles(app, projectId)).toContain(`uploads/${upload.id}.csv`);
    });

    it('reads another delimiter with decimal commas and units in the header', async () => {
      const response = await uploadResults(coordinator, projectId, readFileSync(fixturePath('semicolon-decimal-comma.csv')), 'export.csv').expect(201);
      expect(response.body.upload).toMatchObject({
        delimiter: ';',
        decimalSeparator: ',',
        headers: ['Element', 'Load case', 'Pos [m]', 'V [kN]'],
        guessedMapping: { memberColumn: 'Element', combinationColumn: 'Load case', stationColumn: 'Pos [m]', shearColumn: 'V [kN]', forceUnit: 'kN', lengthUnit: 'm' },
        missingMapping: [],
      });
      expect(response.body.upload.rows[1]).toEqual(['B-104', 'ULS-1', '1,5', '12,25']);
    });

    it('asks which sheet of a workbook with several, then previews the one chosen', async () => {
      const content = await workbook({
        Notes: [['Shear export of the frame analysis'], ['Invented demo data']],
        Shear: [['member', 'combination', 'shear'], ['T1', 'ULS-1', 12.5]],
      });
      const response = await uploadResults(coordinator, projectId, content, 'forces.xlsx').expect(201);
      expect(response.body.upload).toMatchObject({ format: 'xlsx', sheets: ['Notes', 'Shear'], sheet: null, headers: [], rows: [] });
      const preview = await coordinator.get(`${resultsUrl(projectId)}/uploads/${response.body.upload.id}/preview`).query({ sheet: 'Shear' }).expect(200);
      expect(preview.body.upload).toMatchObject({ sheet: 'Shear', headers: ['member', 'combination', 'shear'], rows: [['T1', 'ULS-1', '12.5']] });
      const missing = await coordinator.get(`${resultsUrl(projectId)}/uploads/${response.body.upload.id}/preview`).query({ sheet: 'Loads' }).expect(400);
      expect(missing.body.error).toMatchObject({ code: 'sheet_not_found', details: { sheets: ['Notes', 'Shear'] } });
    });

    it('refuses an empty file, an old .xls workbook and a file of another kind, and keeps nothing', async () => {
      const before = await resultsFootprint(app, projectId);
      const empty = await uploadResults(coordinator, projectId, '', 'empty.csv').expect(400);
      expect(empty.body.error).toMatchObject({ code: 'empty_file', message: 'The file is empty: it holds no header and no rows.' });
      const oleSignature = Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1, 0, 0, 0, 0]);
      const xls = await uploadResults(coordinator, projectId, oleSignature, 'forces.xls').expect(400);
      expect(xls.body.error.code).toBe('unsupported_format');
      expect(xls.body.error.message).toMatch(/save it as \.xlsx or CSV/i);
      const ifc = await uploadResults(coordinator, projectId, readFileSync(buildingSmartSample('column-extruded-solid.ifc')), 'column.ifc').expect(400);
      expect(ifc.body.error.code).toBe('not_results_file');
      const none = await coordinator.post(`${resultsUrl(projectId)}/uploads`).expect(400);
      expect(none.body.error.code).toBe('file_required');
      expect(await resultsFootprint(app, projectId)).toEqual(before);
    });

    it('lets only coordinators upload: 401 anonymous, 404 outsider, 403 engineer and reviewer', async () => {
      const csv = resultsCsv([['T1', 'ULS-1', 1]]);
      await uploadResults(await app.agent(), projectId, csv).expect(401);
      await uploadResults(await app.signIn(team.outsider), projectId, csv).expect(404);
      await uploadResults(await app.signIn(team.engineer), projectId, csv).expect(403);
      await uploadResults(await app.signIn(team.reviewer), projectId, csv).expect(403);
    });
  });

  describe('POST /api/projects/:projectId/results', () => {
    async function upload(content: string | Buffer, fileName = 'shear.csv'): Promise<string> {
      return (await uploadResults(coordinator, projectId, content, fileName).expect(201)).body.upload.id as string;
    }
    const importBody = (uploadId: string, extra: Record<string, unknown> = {}) => ({
      uploadId,
      mapping: DEFAULT_MAPPING,
      modelRevisionId: revision.id,
      name: 'Frame analysis, ULS',
      ...extra,
    });

    it('imports every row in one go: counts, combinations, the file hash, the matching and the stored keys', async () => {
      const content = frameResults();
      const resultSet = await importResults(coordinator, projectId, revision.id, content, { name: 'Frame analysis, ULS' });
      expect(resultSet).toMatchObject({
        name: 'Frame analysis, ULS',
        fileName: 'shear.csv',
        format: 'csv',
        sha256: sha256(content),
        rowCount: 80,
        memberKeys: 40,
        combinations: ['ULS-1', 'ULS-2'],
        forceUnit: 'kN',
        modelRevisionId: revision.id,
        createdBy: { id: team.coordinator.id, name: team.coordinator.name },
        matching: { keys: 40, matched: 40, ambiguous: 0, unmatchedResults: 0, membersWithoutResults: 0, warning: null },
      });
      expect(resultSet.matching).toMatchObject({ byMethod: { tag: 40 } });
      expect(await app.dataSource.getRepository(ResultKey).countBy({ resultSetId: resultSet.id })).toBe(40);
      expect(storedResultFiles(app, projectId)).toContain(`${resultSet.id}/governing.bin`);

      const list = await coordinator.get(resultsUrl(projectId)).expect(200);
      expect(list.body.resultSets.map((set: { id: string }) => set.id)).toContain(resultSet.id);
      const reviewer = await app.signIn(team.reviewer);
      const read = await reviewer.get(`${resultsUrl(projectId)}/${resultSet.id}`).expect(200);
      expect(read.body.resultSet).toEqual(resultSet);
    });

    it('matches keys given as GlobalIds, and saves the mapping as a template when asked', async () => {
      const content = resultsCsv(members.slice(0, 5).map((member) => [member.globalId, 'SLS', 10] as const));
      const resultSet = await importResults(coordinator, projectId, revision.id, content, { saveTemplateAs: 'Frame program export' });
      expect(resultSet.matching).toMatchObject({ matched: 5, membersWithoutResults: 35, byMethod: { globalId: 5 } });
      const templates = await coordinator.get(mappingsUrl(projectId)).expect(200);
      expect(templates.body.templates).toEqual([expect.objectContaining({ name: 'Frame program export', mapping: { ...DEFAULT_MAPPING, memberKeyKind: 'auto' } })]);
    });

    it('refuses a file with bad rows, naming each row, and stores nothing', async () => {
      const uploadId = await upload(readFileSync(fixturePath('bad-rows.csv')));
      const before = await resultsFootprint(app, projectId);
      const response = await coordinator.post(resultsUrl(projectId)).send(importBody(uploadId)).expect(422);
      expect(response.body.error.code).toBe('invalid_rows');
      expect(response.body.error.details.errors).toEqual([
        { row: 3, column: 'member', code: 'member_missing', message: "Row 3 (column 'member'): the member key is empty." },
        { row: 4, column: 'combination', code: 'combination_missing', message: "Row 4 (column 'combination'): the load combination is empty." },
        { row: 5, column: 'shear', code: 'shear_missing', message: "Row 5 (column 'shear'): the shear force is empty." },
        { row: 6, column: 'shear', code: 'not_numeric', message: "Row 6 (column 'shear'): 'twelve' is not a number; expected a shear force in kN." },
        { row: 7, column: null, code: 'duplicate_row', message: "Row 7 repeats member 'B-104', combination 'ULS-1' of row 2." },
      ]);
      expect(await resultsFootprint(app, projectId)).toEqual(before);
    });

    it('refuses an unknown force unit, a column the file lacks and a missing name, before reading any row', async () => {
      const uploadId = await upload(frameResults());
      const before = await resultsFootprint(app, projectId);
      const unit = await coordinator.post(resultsUrl(projectId)).send(importBody(uploadId, { mapping: { ...DEFAULT_MAPPING, forceUnit: 'tonne' } })).expect(400);
      expect(unit.body.error.message).toContain('mapping.forceUnit: unknown force unit "tonne"; use one of N, kN, kip, lbf');
      const column = await coordinator.post(resultsUrl(projectId)).send(importBody(uploadId, { mapping: { ...DEFAULT_MAPPING, shearColumn: 'Vz' } })).expect(400);
      expect(column.body.error).toMatchObject({ code: 'column_missing', details: { columns: ['member', 'combination', 'shear'] } });
      expect(column.body.error.message).toBe("The file has no column 'Vz'. Its columns are: member, combination, shear. Adjust the column mapping.");
      const unnamed = await coordinator.post(resultsUrl(projectId)).send(importBody(uploadId, { name: ' ' })).expect(400);
      expect(unnamed.body.error.details).toEqual([{ location: 'body', field: 'name', message: 'give the results a name' }]);
      expect(await resultsFootprint(app, projectId)).toEqual(before);
    });

    it('asks for the sheet of a workbook with several, and imports the one named', async () => {
      const uploadId = await upload(
        await workbook({ Notes: [['Invented demo data']], Shear: [['member', 'combination', 'shear'], [members[0].tag, 'ULS-1', 12.5]] }),
        'forces.xlsx',
      );
      const ask = await coordinator.post(resultsUrl(projectId)).send(importBody(uploadId)).expect(400);
      expect(ask.body.error).toMatchObject({ code: 'sheet_required', details: { sheets: ['Notes', 'Shear'] } });
      const done = await coordinator.post(resultsUrl(projectId)).send(importBody(uploadId, { sheet: 'Shear' })).expect(201);
      expect(done.body.resultSet).toMatchObject({ format: 'xlsx', sheet: 'Shear', rowCount: 1, matching: { matched: 1 } });
    });

    it('refuses a revision whose model could not be read, and an unknown one', async () => {
      const noLengthUnit = readFileSync(buildingSmartSample('beam-varying-cardinal-points.ifc'), 'latin1').replace(
        'IFCSIUNIT(*,.LENGTHUNIT.,.MILLI.,.METRE.)',
        'IFCSIUNIT(*,.MASSUNIT.,.KILO.,.GRAM.)',
      );
      const failed = await ingestModel(coordinator, projectId, noLengthUnit, 'no-units.ifc');
      expect(failed.status).toBe('failed');
      const uploadId = await upload(frameResults());
      const before = await resultsFootprint(app, projectId);
      const refused = await coordinator.post(resultsUrl(projectId)).send(importBody(uploadId, { modelRevisionId: failed.id })).expect(409);
      expect(refused.body.error.code).toBe('revision_not_ready');
      expect(refused.body.error.message).toMatch(/^The model of revision \d+ \(no-units\.ifc\) could not be read/);
      await coordinator.post(resultsUrl(projectId)).send(importBody(uploadId, { modelRevisionId: team.project.id })).expect(404);
      expect(await resultsFootprint(app, projectId)).toEqual(before);
    });

    it('imports results of another model with a loud warning: almost nothing matches', async () => {
      const strangers = Array.from({ length: 20 }, (_, i): [string, string, number] => [`GRID-${i}`, 'ULS-1', 10]);
      const content = resultsCsv([...strangers, [members[0].tag!, 'ULS-1', 10]]);
      const resultSet = await importResults(coordinator, projectId, revision.id, content);
      expect(resultSet.matching).toMatchObject({ keys: 21, matched: 1, unmatchedResults: 20, likelyOtherModel: true });
      expect(resultSet.matching.warning).toBe(
        'Only 1 of 21 result keys (5 %) match a member of revision 1 (frame-rev-A.ifc). ' +
          'These results are probably for another model: check the file and the model before running a check.',
      );
    });

    it('refuses a template name already taken, and then stores nothing at all', async () => {
      await coordinator.post(mappingsUrl(projectId)).send({ name: 'Taken', mapping: DEFAULT_MAPPING }).expect(201);
      const uploadId = await upload(frameResults());
      const before = await resultsFootprint(app, projectId);
      const response = await coordinator.post(resultsUrl(projectId)).send(importBody(uploadId, { saveTemplateAs: 'Taken' })).expect(409);
      expect(response.body.error.code).toBe('template_name_taken');
      expect(await resultsFootprint(app, projectId)).toEqual(before);
    });

    it('lets only coordinators import', async () => {
      const uploadId = await upload(frameResults());
      await (await app.signIn(team.engineer)).post(resultsUrl(projectId)).send(importBody(uploadId)).expect(403);
      await (await app.signIn(team.outsider)).post(resultsUrl(projectId)).send(importBody(uploadId)).expect(404);
      await (await app.agent()).post(resultsUrl(projectId)).send(importBody(uploadId)).expect(401);
    });
  });

  describe('GET …/results/:resultSetId/matching and PUT …/matches/:resultKey', () => {
    let resultSetId: string;
    let strangerKey: string;

    beforeAll(async () => {
      // Two analysis keys the model does not know: a member renamed in the analysis, and a member missing from it.
      strangerKey = 'ANALYSIS-BEAM-17';
      const rows = members.slice(1).flatMap((member) => [[member.tag!, 'ULS-1', 50] as const]);
      const resultSet = await importResults(coordinator, projectId, revision.id, resultsCsv([...rows, [strangerKey, 'ULS-1', 75], ['GHOST-9', 'ULS-1', 5]]));
      resultSetId = resultSet.id;
    });

    const matchingUrl = () => `${resultsUrl(projectId)}/${resultSetId}/matching`;

    it('pages the report by filter: matched keys, unmatched keys and members without results', async () => {
      const reviewer = await app.signIn(team.reviewer);
      const all = await reviewer.get(matchingUrl()).query({ pageSize: 10 }).expect(200);
      expect(all.body.summary).toMatchObject({ keys: 41, matched: 39, unmatchedResults: 2, membersWithoutResults: 1 });
      expect(all.body.total).toBe(41);
      expect(all.body.items).toHaveLength(10);
      expect(all.body.items[0]).toEqual({ resultKey: members[1].tag, globalId: members[1].globalId, tag: members[1].tag, name: members[1].name, method: 'tag', candidates: [] });
      const unmatched = await reviewer.get(matchingUrl()).query({ filter: 'unmatched' }).expect(200);
      expect(unmatched.body.items.map((item: { resultKey: string }) => item.resultKey)).toEqual([strangerKey, 'GHOST-9']);
      const without = await reviewer.get(matchingUrl()).query({ filter: 'members-without-results' }).expect(200);
      expect(without.body.items).toEqual([{ resultKey: null, globalId: members[0].globalId, tag: members[0].tag, name: members[0].name, method: null, candidates: [] }]);
      const page4 = await reviewer.get(matchingUrl()).query({ pageSize: 10, page: 4 }).expect(200);
      expect(page4.body.items).toHaveLength(1);
    });

    it('lets the coordinator fix a match by hand, which updates the report and the stored summary', async () => {
      const response = await coordinator.put(`${resultsUrl(projectId)}/${resultSetId}/matches/${strangerKey}`).send({ globalId: members[0].globalId }).expect(200);
      expect(response.body.item).toEqual({ resultKey: strangerKey, globalId: members[0].globalId, tag: members[0].tag, name: members[0].name, method: 'manual', candidates: [] });
      expect(response.body.summary).toMatchObject({ matched: 40, unmatchedResults: 1, membersWithoutResults: 0, byMethod: { manual: 1 } });
      const stored = await app.dataSource.getRepository(ResultSet).findOneByOrFail({ id: resultSetId });
      expect(stored.matching).toMatchObject({ matched: 40, unmatchedResults: 1 });
    });

    it('keeps manual matches for the project: a later revision and a later results file use them', async () => {
      // The next revision of the same model: same GlobalIds.
      const next = await ingestModel(coordinator, projectId, generateFrame({ members: 40, fileName: 'frame-rev-B.ifc' }), 'frame-rev-B.ifc');
      const against = await coordinator.get(matchingUrl()).query({ modelRevisionId: next.id, filter: 'matched', pageSize: 100 }).expect(200);
      expect(against.body.items).toContainEqual(expect.objectContaining({ resultKey: strangerKey, globalId: members[0].globalId, method: 'manual' }));
      const later = await importResults(coordinator, projectId, next.id, resultsCsv([[strangerKey, 'ULS-3', 80]]));
      expect(later.matching).toMatchObject({ matched: 1, byMethod: { manual: 1 } });
    });

    it('clears a manual match with null', async () => {
      const response = await coordinator.put(`${resultsUrl(projectId)}/${resultSetId}/matches/${strangerKey}`).send({ globalId: null }).expect(200);
      expect(response.body.item).toMatchObject({ resultKey: strangerKey, globalId: null, method: null });
      expect(response.body.summary).toMatchObject({ matched: 39, unmatchedResults: 2 });
    });

    it('refuses a member the revision does not have, a key the results do not have, and non-coordinators', async () => {
      const url = `${resultsUrl(projectId)}/${resultSetId}/matches`;
      const before = await resultsFootprint(app, projectId);
      const member = await coordinator.put(`${url}/${strangerKey}`).send({ globalId: '0000000000000000000000' }).expect(400);
      expect(member.body.error).toMatchObject({ code: 'member_not_found', details: [{ field: 'globalId' }] });
      const key = await coordinator.put(`${url}/NOT-A-KEY`).send({ globalId: members[0].globalId }).expect(404);
      expect(key.body.error.code).toBe('result_key_not_found');
      await (await app.signIn(team.engineer)).put(`${url}/${strangerKey}`).send({ globalId: members[0].globalId }).expect(403);
      await (await app.signIn(team.reviewer)).put(`${url}/${strangerKey}`).send({ globalId: members[0].globalId }).expect(403);
      expect(await resultsFootprint(app, projectId)).toEqual(before);
    });

    it('is readable by every member and no one else', async () => {
      await (await app.signIn(team.engineer)).get(matchingUrl()).expect(200);
      await (await app.signIn(team.outsider)).get(matchingUrl()).expect(404);
      await (await app.agent()).get(matchingUrl()).expect(401);
    });
  });

  describe('layouts analysis exports use, imported with the mapping the preview guesses', () => {
    /** Uploads, checks the guess is complete and sure, imports with it; returns the preview and the result set. */
    async function importGuessed(content: string | Buffer, fileName: string, extra: Record<string, unknown> = {}) {
      const upload = (await uploadResults(coordinator, projectId, content, fileName).expect(201)).body.upload;
      expect(upload.missingMapping).toEqual([]);
      expect(upload.unsureMapping).toEqual([]);
      const response = await coordinator
        .post(resultsUrl(projectId))
        .send({ uploadId: upload.id, mapping: upload.guessedMapping, modelRevisionId: revision.id, name: fileName, ...extra })
        .expect(201);
      return { upload, resultSet: response.body.resultSet };
    }

    it('a European export: semicolons, decimal commas, CRLF and a station column x [m]', async () => {
      const { upload, resultSet } = await importGuessed(readFileSync(fixturePath('european-export.csv')), 'european-export.csv');
      expect(upload.guessedMapping).toEqual({
        memberColumn: 'Member',
        combinationColumn: 'Load combination',
        stationColumn: 'x [m]',
        shearColumn: 'Vz [kN]',
        majorMomentColumn: 'My [kNm]',
        forceUnit: 'kN',
        momentUnit: 'kNm',
        lengthUnit: 'm',
        memberKeyKind: 'auto',
      });
      expect(resultSet).toMatchObject({ rowCount: 18, memberKeys: 3, combinations: ['CO1', 'CO2'] });
    });

    it('one column per combination', async () => {
      const { resultSet } = await importGuessed(readFileSync(fixturePath('wide-combinations.csv')), 'wide-combinations.csv');
      expect(resultSet).toMatchObject({ rowCount: 6, memberKeys: 2, combinations: ['CO1', 'CO2', 'CO3'], mapping: { combinationColumns: ['Vz CO1 [kN]', 'Vz CO2 [kN]', 'Vz CO3 [kN]'] } });
    });

    it('envelope rows', async () => {
      const { resultSet } = await importGuessed(readFileSync(fixturePath('envelope-rows.tsv')), 'envelope-rows.tsv');
      expect(resultSet).toMatchObject({ rowCount: 8, combinations: ['envelope max', 'envelope min'] });
    });

    it('units in a second header row, shown in the preview', async () => {
      const { upload, resultSet } = await importGuessed(readFileSync(fixturePath('units-row.csv')), 'units-row.csv');
      expect(upload).toMatchObject({ unitsRow: 2, units: ['', '', 'm', 'kN', 'kNm'], rows: [['TopMid', 'CO1', '0', '-98.40', '0'], expect.anything(), expect.anything(), expect.anything(), expect.anything(), expect.anything()] });
      expect(resultSet.rowCount).toBe(6);
    });

    it('several sheets of one workbook, the sheet naming the combination', async () => {
      const content = await workbook(SHEET_PER_COMBINATION);
      const upload = (await uploadResults(coordinator, projectId, content, 'per-combination.xlsx').expect(201)).body.upload;
      expect(upload.sheets).toEqual(['Notes', 'CO1', 'CO2']);
      const mapping = { memberColumn: 'Member', stationColumn: 'x [m]', shearColumn: 'Vz [kN]', forceUnit: 'kN', lengthUnit: 'm', sheets: ['CO1', 'CO2'], combinationFromSheet: true };
      const response = await coordinator.post(resultsUrl(projectId)).send({ uploadId: upload.id, mapping, modelRevisionId: revision.id, name: 'Per combination' }).expect(201);
      expect(response.body.resultSet).toMatchObject({ sheet: 'CO1, CO2', rowCount: 12, combinations: ['CO1', 'CO2'] });
    });

    it('asks instead of guessing when the header does not settle a column, naming the candidates', async () => {
      const upload = (await uploadResults(coordinator, projectId, 'Member,Combination,Load case,V2 [kN],V3 [kN]\nB1,CO1,LC1,1,2\n', 'numbered.csv').expect(201)).body.upload;
      expect(upload.unsureMapping).toEqual([
        { field: 'combinationColumn', columns: ['Combination', 'Load case'], why: 'each could be the load combination' },
        { field: 'shearColumn', columns: ['V2 [kN]', 'V3 [kN]'], why: expect.stringContaining('numbered local axes') },
      ]);
    });
  });

  describe('/api/projects/:projectId/result-mappings', () => {
    it('downloads a template as the mapping file taulens check --mapping reads, and the command line checks with it', async () => {
      const mapping = { memberColumn: 'Member', combinationColumn: 'Load combination', stationColumn: 'x [m]', shearColumn: 'Vz [kN]', forceUnit: 'kN', lengthUnit: 'm', memberKeyKind: 'name' };
      const created = await coordinator.post(mappingsUrl(projectId)).send({ name: 'European export, v2', mapping }).expect(201);
      const download = await (await app.signIn(team.reviewer)).get(`${mappingsUrl(projectId)}/${created.body.template.id}/download`).expect(200);
      expect(download.headers['content-disposition']).toBe('attachment; filename=European-export-v2.mapping.json');
      expect(JSON.parse(download.text)).toEqual(mapping);
      await (await app.signIn(team.outsider)).get(`${mappingsUrl(projectId)}/${created.body.template.id}/download`).expect(404);
      await coordinator.get(`${mappingsUrl(projectId)}/${team.project.id}/download`).expect(404);

      const files = tempFiles('taulens-mapping-');
      try {
        let stdout = '';
        const status = await dispatch(
          ['check', buildingSmartSample('beam-varying-cardinal-points.ifc'), '--forces', fixturePath('european-export.csv'), '--mapping', files.write('european.mapping.json', download.text), '--standard', 'en1993-1-1', '--json'],
          { out: (text) => (stdout += text), err: () => undefined },
        );
        expect(status).toBe(1);
        const output = JSON.parse(stdout);
        expect(output.forces.mapping).toEqual(mapping);
        expect(output.members.find((member: { name: string }) => member.name === 'BotMid').governing).toMatchObject({ combination: 'CO1', station_m: 5, VEd_kN: -200 });
      } finally {
        files.remove();
      }
    });


    it('saves, lists and deletes templates; only coordinators change them', async () => {
      const mapping = { ...DEFAULT_MAPPING, stationColumn: 'x', lengthUnit: 'm', memberKeyKind: 'tag' };
      const created = await coordinator.post(mappingsUrl(projectId)).send({ name: 'With stations', mapping }).expect(201);
      expect(created.body.template).toMatchObject({ name: 'With stations', mapping });
      const engineer = await app.signIn(team.engineer);
      const list = await engineer.get(mappingsUrl(projectId)).expect(200);
      expect(list.body.templates.map((template: { name: string }) => template.name)).toContain('With stations');
      await engineer.delete(`${mappingsUrl(projectId)}/${created.body.template.id}`).expect(403);
      await coordinator.delete(`${mappingsUrl(projectId)}/${created.body.template.id}`).expect(204);
      await coordinator.delete(`${mappingsUrl(projectId)}/${created.body.template.id}`).expect(404);
    });

    it('refuses a mapping with a station column but no length unit', async () => {
      const response = await coordinator.post(mappingsUrl(projectId)).send({ name: 'Broken', mapping: { ...DEFAULT_MAPPING, stationColumn: 'x' } }).expect(400);
      expect(response.body.error.details).toEqual([{ location: 'body', field: 'mapping.lengthUnit', message: 'choose the length unit of the station and coordinate columns' }]);
    });
  });

  describe('uploads never imported', () => {
    const HOUR_MS = 3_600_000;

    it('go after the keep time with their file; the file of an imported set stays with the set', async () => {
      const uploads = app.dataSource.getRepository(ResultsUpload);
      const csv = resultsCsv([[members[0].tag!, 'ULS-1', 12]]);
      const abandoned = (await uploadResults(coordinator, projectId, csv, 'abandoned.csv').expect(201)).body.upload;
      const kept = await importResults(coordinator, projectId, revision.id, resultsCsv([[members[1].tag!, 'ULS-1', 14]]), { name: 'Kept after the sweep' });
      const keptFile = (await app.dataSource.getRepository(ResultSet).findOneByOrFail({ id: kept.id })).fileKey;
      const keptUpload = await uploads.findOneByOrFail({ fileKey: keptFile });
      const fresh = (await uploadResults(coordinator, projectId, csv, 'fresh.csv').expect(201)).body.upload;
      for (const id of [abandoned.id, keptUpload.id]) await uploads.update({ id }, { createdAt: new Date(Date.now() - 100 * HOUR_MS) });

      const removed = await removeStaleUploads({ dataSource: app.dataSource, storage: app.server.context.storage }, new Date(Date.now() - 72 * HOUR_MS));

      expect(removed).toBe(2);
      expect(await uploads.existsBy({ id: abandoned.id })).toBe(false);
      expect(await uploads.existsBy({ id: keptUpload.id })).toBe(false);
      expect(await uploads.existsBy({ id: fresh.id })).toBe(true);
      const files = storedResultFiles(app, projectId);
      expect(files).not.toContain(`uploads/${abandoned.id}.csv`);
      expect(files).toContain(`uploads/${keptUpload.id}.csv`);
      expect(files).toContain(`uploads/${fresh.id}.csv`);
      const gone = await coordinator.get(`${resultsUrl(projectId)}/uploads/${abandoned.id}/preview`).expect(404);
      expect(gone.body.error.code).toBe('upload_not_found');
      await coordinator.get(`${resultsUrl(projectId)}/${kept.id}`).expect(200);
    });
  });
});
