import yauzl from 'yauzl';
import { schemaErrors, schemaForEntry } from '../../../test/fixtures/bcf/bcf-schemas';
import { MEMBER_IDS, SAMPLE_FINDINGS, SAMPLE_PROJECT, TINY_PNG } from '../../../test/fixtures/bcf/sample-findings';
import type { FindingExport } from '../export/finding-export';
import { framingCamera } from './bcf-camera';
import { bcfEntries, exportBcf } from './bcf-export';
import { BCF_VERSIONS, type BcfVersion } from './bcf-version';

const MODEL_FILES = [{ fileName: 'depot-rev-B.ifc', date: '2026-01-30T16:00:00Z', ifcProjectGlobalId: '0YvctVUKr0kugbFTf53O9L' }];

function entriesOf(version: BcfVersion, findings: readonly FindingExport[] = SAMPLE_FINDINGS) {
  return bcfEntries(findings, { version, project: SAMPLE_PROJECT, modelFiles: MODEL_FILES, users: ['lead@example.com'] });
}

function entryText(version: BcfVersion, name: string, findings?: readonly FindingExport[]): string {
  const entry = entriesOf(version, findings).find((candidate) => candidate.name === name);
  if (!entry) throw new Error(`no entry ${name}`);
  return entry.bytes.toString('utf8');
}

function zipNames(archive: Buffer): Promise<string[]> {
  return new Promise((resolve, reject) => {
    yauzl.fromBuffer(archive, { lazyEntries: true }, (error, zip) => {
      if (error) return reject(error);
      const names: string[] = [];
      zip.on('entry', (entry: yauzl.Entry) => {
        names.push(entry.fileName);
        zip.readEntry();
      });
      zip.on('end', () => resolve(names));
      zip.on('error', reject);
      zip.readEntry();
    });
  });
}

const TOPIC = 'ed3df4a9-3705-4406-a2a8-fb1b66196adc';

describe.each(BCF_VERSIONS)('BCF %s export', (version) => {
  it('uses a schema check that can fail (a topic without Title is invalid)', async () => {
    const markup = entryText(version, `${TOPIC}/markup.bcf`).replace(/<Title>.*<\/Title>/, '');
    expect(await schemaErrors(version, 'markup', 'markup.bcf', markup)).not.toEqual([]);
  });

  it('writes only files that validate against the official buildingSMART XSDs', async () => {
    const entries = entriesOf(version);
    const xmlEntries = entries.filter((entry) => schemaForEntry(entry.name) !== undefined);
    // bcf.version, project.bcfp, (3.0) extensions.xml, and markup + viewpoint for each of the three topics.
    expect(xmlEntries).toHaveLength(version === '3.0' ? 9 : 8);
    for (const entry of xmlEntries) {
      const errors = await schemaErrors(version, schemaForEntry(entry.name)!, entry.name, entry.bytes);
      expect({ name: entry.name, errors }).toEqual({ name: entry.name, errors: [] });
    }
  });

  it('puts one folder per topic GUID (lowercase) with markup, viewpoint and snapshot into the zip', async () => {
    const archive = await exportBcf(SAMPLE_FINDINGS, { version, project: SAMPLE_PROJECT, exportedAt: new Date('2026-02-10T12:00:00Z') });
    const names = await zipNames(archive);
    expect(names.slice(0, 2)).toEqual(['bcf.version', 'project.bcfp']);
    expect(names).toContain(`${TOPIC}/markup.bcf`);
    expect(names).toContain(`${TOPIC}/viewpoint.bcfv`);
    expect(names).toContain(`${TOPIC}/snapshot.png`);
    expect(names).not.toContain('9b40e785-20ff-4e40-abff-3b4140437fe1/snapshot.png');
    expect(names.includes('extensions.xml')).toBe(version === '3.0');
  });

  it('escapes user text and replaces characters XML cannot carry', () => {
    const markup = entryText(version, `${TOPIC}/markup.bcf`);
    expect(markup).toContain('B-12 web over capacity &lt;EN 1993-1-1 §6.2.6&gt; &amp; &quot;check&quot;');
    expect(markup).toContain('&lt;b&gt;not html&lt;/b&gt;');
    expect(markup).toContain('a bell \uFFFD character');
    expect(markup).not.toContain('\u0007');
  });

  it('writes our status, type, priority and the labels once each', () => {
    const markup = entryText(version, `${TOPIC}/markup.bcf`);
    expect(markup).toContain('TopicStatus="Open"');
    expect(markup).toContain('TopicType="Web shear failure"');
    expect(markup).toContain('<Priority>High</Priority>');
    expect(markup.match(/>Level 2</g)).toHaveLength(1);
    expect(markup).toContain('<DueDate>2026-03-20T00:00:00.000Z</DueDate>');
    expect(markup).toContain('<AssignedTo>eng.one@example.com</AssignedTo>');
  });

  it('selects the member by its 22-character IfcGuid and keeps the visibility exceptions', () => {
    const visinfo = entryText(version, `${TOPIC}/viewpoint.bcfv`);
    expect(visinfo).toMatch(new RegExp(`<Selection>\\s*<Component IfcGuid="${MEMBER_IDS.beamB12}"`));
    expect(visinfo).toContain('DefaultVisibility="true"');
    expect(visinfo).toContain(`<Component IfcGuid="${MEMBER_IDS.slabEdge}"`);
  });

  it('writes the justification of an accepted finding as a comment with its author and date, valid against the XSD', async () => {
    const acceptance = { justification: 'Bearing stiffener pair <12 mm> on the fabrication drawings (invented).', author: 'lead@example.com', date: '2026-02-07T08:30:00+01:00' };
    const accepted: FindingExport = { ...SAMPLE_FINDINGS[2], acceptance };
    const name = `${accepted.guid}/markup.bcf`;
    const markup = entryText(version, name, [accepted]);
    expect(await schemaErrors(version, 'markup', 'markup.bcf', markup)).toEqual([]);
    const comment = /<Comment Guid="([0-9a-f-]{36})">\s*<Date>2026-02-07T07:30:00.000Z<\/Date>\s*<Author>lead@example.com<\/Author>\s*<Comment>Accepted as it is: Bearing stiffener pair &lt;12 mm&gt; on the fabrication drawings \(invented\).<\/Comment>/.exec(markup);
    expect(comment).not.toBeNull();
    // In date order among the topic's other comments, and the same GUID in every export.
    expect(markup.indexOf('841e2817-dc72-4b63-abb6-38f0b1bfc064')).toBeLessThan(markup.indexOf(comment![1]));
    expect(entryText(version, name, [accepted])).toContain(comment![1]);
    if (version === '3.0') expect(entryText(version, 'extensions.xml', [accepted])).toContain('<User>lead@example.com</User>');
  });

  it('derives the same viewpoint GUID every time when the finding has none', () => {
    const name = '9b40e785-20ff-4e40-abff-3b4140437fe1/viewpoint.bcfv';
    expect(entryText(version, name)).toEqual(entryText(version, name));
  });
});

describe('release differences', () => {
  const acceptedTopic = '4adeea36-5a38-4f36-8f7a-a80ce18a6e86/viewpoint.bcfv';

  it('limits the field of view to 45–60° in 2.1 (visinfo.xsd) and keeps it in 3.0', () => {
    expect(entryText('2.1', acceptedTopic)).toContain('<FieldOfView>60</FieldOfView>');
    expect(entryText('3.0', acceptedTopic)).toContain('<FieldOfView>75</FieldOfView>');
    expect(entryText('3.0', acceptedTopic)).toContain('<AspectRatio>1.5</AspectRatio>');
    expect(entryText('2.1', acceptedTopic)).not.toContain('AspectRatio');
  });

  it('lists our statuses, types, priorities, labels and users in 3.0 extensions.xml', () => {
    const extensions = entryText('3.0', 'extensions.xml');
    for (const status of ['Open', 'In progress', 'Resolved', 'Ready to verify', 'Verified', 'Accepted']) {
      expect(extensions).toContain(`<TopicStatus>${status}</TopicStatus>`);
    }
    expect(extensions).toContain('<TopicLabel>Transfer beams</TopicLabel>');
    expect(extensions).toContain('<User>lead@example.com</User>');
    expect(extensions).toContain('<User>eng.two@example.com</User>');
  });

  it('2.1 without a viewpoint selects the finding members with everything visible', async () => {
    const bare: FindingExport = { ...SAMPLE_FINDINGS[1], viewpoint: undefined };
    const visinfo = entryText('2.1', `${bare.guid}/viewpoint.bcfv`, [bare]);
    expect(visinfo).toContain(`<Component IfcGuid="${MEMBER_IDS.columnC3}"`);
    expect(visinfo).toContain('DefaultVisibility="true"');
    expect(visinfo).not.toContain('Camera');
    expect(await schemaErrors('2.1', 'visinfo', 'viewpoint.bcfv', visinfo)).toEqual([]);
  });

  it('a framing camera makes a finding without a 3D view exportable as 3.0', async () => {
    const camera = framingCamera({ min_m: [0, 0, 3], max_m: [6, 0.3, 3.3] });
    const framed: FindingExport = {
      ...SAMPLE_FINDINGS[1],
      viewpoint: { camera, selectedGlobalIds: [MEMBER_IDS.columnC3], visibility: { defaultVisible: true, exceptionGlobalIds: [] } },
    };
    const visinfo = entryText('3.0', `${framed.guid}/viewpoint.bcfv`, [framed]);
    expect(await schemaErrors('3.0', 'visinfo', 'viewpoint.bcfv', visinfo)).toEqual([]);
  });
});

describe('framingCamera', () => {
  it('looks at the box centre from a distance that fits its bounding sphere in the view', () => {
    const camera = framingCamera({ min_m: [0, 0, 0], max_m: [6, 8, 0] });
    // radius 5 m, 60° vertical field of view: distance = 5 / sin 30° = 10 m (plain geometry).
    const toCentre = [3 - camera.viewPoint_m[0], 4 - camera.viewPoint_m[1], 0 - camera.viewPoint_m[2]];
    expect(Math.hypot(...toCentre)).toBeCloseTo(10, 9);
    const dot = toCentre[0] * camera.direction[0] + toCentre[1] * camera.direction[1] + toCentre[2] * camera.direction[2];
    expect(dot).toBeCloseTo(10, 9);
    const upDotDirection = camera.up[0] * camera.direction[0] + camera.up[1] * camera.direction[1] + camera.up[2] * camera.direction[2];
    expect(upDotDirection).toBeCloseTo(0, 12);
    expect(camera.up[2]).toBeGreaterThan(0);
  });
});

describe('export refuses data that would make an invalid file', () => {
  const base = SAMPLE_FINDINGS[0];
  const cases: [string, FindingExport, BcfVersion, RegExp][] = [
    ['a blank title', { ...base, title: '  ' }, '2.1', /F-0001: title must not be blank/],
    ['a topic GUID that is not a UUID', { ...base, guid: 'F-0001' }, '2.1', /F-0001: guid must be a UUID/],
    ['a member id that is not a GlobalId', { ...base, memberGlobalIds: ['B-12'] }, '2.1', /memberGlobalIds holds "B-12"/],
    ['a bad creation date', { ...base, createdAt: 'yesterday' }, '3.0', /createdAt must be an ISO 8601 date/],
    ['a snapshot that is not PNG', { ...base, snapshotPng: Buffer.from('GIF89a......') }, '2.1', /snapshotPng is not a PNG image/],
    ['a 3.0 viewpoint without camera', { ...base, viewpoint: undefined }, '3.0', /viewpoint.camera is missing; BCF 3.0/],
    [
      'a camera looking nowhere',
      { ...base, viewpoint: { ...base.viewpoint!, camera: { ...(base.viewpoint!.camera as object), direction: [0, 0, 0] } as never } },
      '3.0',
      /viewpoint.camera.direction must not be the zero vector/,
    ],
  ];

  it.each(cases)('%s', (_label, finding, version, message) => {
    expect(() => entriesOf(version, [finding])).toThrow(message);
  });

  it('two findings with the same GUID', () => {
    const twin = { ...SAMPLE_FINDINGS[1], guid: base.guid.toLowerCase() };
    expect(() => entriesOf('2.1', [base, twin])).toThrow(/F-0001 and F-0002 have the same GUID/);
  });

  it('a snapshot still goes in unchanged when valid', () => {
    const snapshot = entriesOf('3.0').find((entry) => entry.name === `${TOPIC}/snapshot.png`);
    expect(snapshot?.bytes.equals(TINY_PNG)).toBe(true);
  });
});
