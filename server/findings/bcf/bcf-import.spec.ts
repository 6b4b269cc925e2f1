import { ConflictError, PayloadTooLargeError, ValidationError } from '../../http/errors';
import {
  ENTITY_EXPANSION_VERSION,
  TOPIC_GUID,
  VERSION_2_1,
  VERSION_3_0,
  XXE_MARKUP,
  markup21,
  zipOf,
} from '../../../test/fixtures/bcf/hostile-archives';
import { MEMBER_IDS, SAMPLE_FINDINGS, SAMPLE_PROJECT, TINY_PNG } from '../../../test/fixtures/bcf/sample-findings';
import { exportBcf } from './bcf-export';
import { importBcf } from './bcf-import';
import { BCF_VERSIONS } from './bcf-version';

const KNOWN_TOPICS = SAMPLE_FINDINGS.map((finding) => finding.guid);
const KNOWN_ELEMENTS = Object.values(MEMBER_IDS);

async function refusal(archive: Buffer | Promise<Buffer>, options?: Parameters<typeof importBcf>[1]): Promise<Error> {
  try {
    await importBcf(await archive, options);
  } catch (error) {
    return error as Error;
  }
  throw new Error('the import was expected to fail');
}

describe.each(BCF_VERSIONS)('BCF %s round trip', (version) => {
  let imported: Awaited<ReturnType<typeof importBcf>>;

  beforeAll(async () => {
    const archive = await exportBcf(SAMPLE_FINDINGS, { version, project: SAMPLE_PROJECT });
    imported = await importBcf(archive, { knownTopicGuids: KNOWN_TOPICS, knownGlobalIds: KNOWN_ELEMENTS, unknownGuids: 'reject' });
  });

  it('reads the version, project and every topic back', () => {
    expect(imported.version).toBe(version);
    expect(imported.project).toEqual(SAMPLE_PROJECT);
    expect(imported.topics.map((topic) => topic.guid)).toEqual(SAMPLE_FINDINGS.map((finding) => finding.guid.toLowerCase()));
    expect(imported.warnings).toEqual([]);
    expect(imported.unknown).toEqual({ topicGuids: [], globalIds: [], statuses: [] });
  });

  it('gives back the same statuses, comments and selected GlobalIds', () => {
    for (const [i, finding] of SAMPLE_FINDINGS.entries()) {
      const topic = imported.topics[i];
      expect(topic.statusId).toBe(finding.status);
      expect(topic.comments.map(({ guid, author, date, text }) => ({ guid, author, date, text }))).toEqual(
        finding.comments.map((comment) => ({ ...comment, date: new Date(comment.date).toISOString() })),
      );
      expect(topic.viewpoints[0].selectedGlobalIds).toEqual(finding.viewpoint!.selectedGlobalIds);
      expect(topic.viewpoints[0].visibility).toEqual(finding.viewpoint!.visibility);
    }
  });

  it('keeps title, labels, priority, assignee, dates, camera, clipping and snapshot', () => {
    const [first, second] = imported.topics;
    expect(first.title).toBe('B-12 web over capacity <EN 1993-1-1 §6.2.6> & "check"');
    expect(first.labels).toEqual(['Level 2', 'Transfer beams']);
    expect(first.priority).toBe('High');
    expect(first.assignedTo).toBe('eng.one@example.com');
    expect(first.dueDate).toBe('2026-03-20T00:00:00.000Z');
    expect(first.viewpoints[0].guid).toBe('67785094-d43e-4c7a-8c4d-42c5546c526f');
    expect(first.viewpoints[0].camera).toMatchObject({ kind: 'perspective', viewPoint_m: [12.5, -8.25, 9.75], fieldOfView_deg: 50 });
    expect(first.viewpoints[0].snapshotPng?.equals(TINY_PNG)).toBe(true);
    expect(second.viewpoints[0].camera).toMatchObject({ kind: 'orthogonal', viewToWorldScale_m: 18.5 });
    expect(second.viewpoints[0].clippingPlanes).toEqual([{ location_m: [4, 4, 3.5], direction: [0, 0, 1] }]);
    expect(second.viewpoints[0].snapshotPng).toBeUndefined();
  });
});

describe('statuses written by other tools', () => {
  it('maps our labels in any case and spacing, and reports the rest', async () => {
    const archive = await zipOf([
      { name: 'bcf.version', contents: VERSION_2_1 },
      { name: `${TOPIC_GUID}/markup.bcf`, contents: markup21('In  Progress') },
      { name: '7e0b7d8a-1f7c-4d1e-8a51-0d3b5c2a9e44/markup.bcf', contents: markup21('Closed').replace(TOPIC_GUID, '7e0b7d8a-1f7c-4d1e-8a51-0d3b5c2a9e44') },
    ]);
    const result = await importBcf(archive);
    expect(result.topics.map((topic) => topic.statusId)).toEqual(['in_progress', undefined]);
    expect(result.unknown.statuses).toEqual(['Closed']);
  });

  it('reads a topic folder whose viewpoint is not listed in the markup (BCF 2.0 layout)', async () => {
    const visinfo =
      '<VisualizationInfo Guid="1c5f7a42-2b7e-4c1a-9d3e-5a6b7c8d9e0f"><Components><Selection>' +
      `<Component IfcGuid="${MEMBER_IDS.beamB14}"/></Selection><Visibility DefaultVisibility="true"/></Components></VisualizationInfo>`;
    const archive = await zipOf([
      { name: 'bcf.version', contents: VERSION_2_1 },
      { name: `${TOPIC_GUID}/markup.bcf`, contents: markup21('Open') },
      { name: `${TOPIC_GUID}/viewpoint.bcfv`, contents: visinfo },
    ]);
    const [topic] = (await importBcf(archive)).topics;
    expect(topic.viewpoints).toHaveLength(1);
    expect(topic.viewpoints[0].guid).toBe('1c5f7a42-2b7e-4c1a-9d3e-5a6b7c8d9e0f');
    expect(topic.viewpoints[0].selectedGlobalIds).toEqual([MEMBER_IDS.beamB14]);
  });
});

describe('unknown GUIDs', () => {
  const foreignTopic = { ...SAMPLE_FINDINGS[0], guid: '5a1e0f7c-3b2d-4e6f-8a9b-0c1d2e3f4a5b' };
  const foreignArchive = () => exportBcf([foreignTopic], { version: '2.1', project: SAMPLE_PROJECT });

  it('are reported to the caller by default', async () => {
    const result = await importBcf(await foreignArchive(), { knownTopicGuids: KNOWN_TOPICS, knownGlobalIds: [MEMBER_IDS.columnC3] });
    expect(result.unknown.topicGuids).toEqual([foreignTopic.guid]);
    expect(result.unknown.globalIds).toEqual([MEMBER_IDS.beamB12, MEMBER_IDS.slabEdge]);
  });

  it('refuse the whole file when the caller asks, naming them', async () => {
    const error = await refusal(foreignArchive(), { knownTopicGuids: KNOWN_TOPICS, knownGlobalIds: KNOWN_ELEMENTS, unknownGuids: 'reject' });
    expect(error).toBeInstanceOf(ConflictError);
    expect(error.message).toBe(
      `The BCF file was not imported: it refers to 1 topic(s) that match no finding of this project (${foreignTopic.guid}). Nothing was changed.`,
    );
    expect((error as ConflictError).code).toBe('bcf_unknown_guids');
  });
});

describe('bad BCF input is refused with a clear message', () => {
  it('not a zip: a text file', async () => {
    const error = await refusal(Buffer.from('GlobalId;Title\n1;hello\n'));
    expect(error).toBeInstanceOf(ValidationError);
    expect(error.message).toBe('The file is not a BCF archive: it is not a readable zip file (it does not start with a zip signature).');
  });

  it('not a zip: a zip cut short', async () => {
    const archive = await exportBcf(SAMPLE_FINDINGS, { version: '2.1', project: SAMPLE_PROJECT });
    const error = await refusal(archive.subarray(0, archive.length - 40));
    expect((error as ValidationError).code).toBe('bcf_not_zip');
    expect(error.message).toMatch(/^The file is not a BCF archive: it is not a readable zip file \(/);
  });

  it('a zip without bcf.version', async () => {
    const error = await refusal(zipOf([{ name: 'readme.txt', contents: 'hello' }]));
    expect(error.message).toBe('The zip has no bcf.version at its root, so it is not a BCF archive.');
  });

  it('a BCF release we do not read', async () => {
    const error = await refusal(zipOf([{ name: 'bcf.version', contents: '<Version VersionId="2.0"/>' }]));
    expect(error.message).toBe('bcf.version says BCF version "2.0"; Taulens reads BCF 2.1 and 3.0.');
  });

  it('a zip bomb: one entry of zeros that expands a thousandfold', async () => {
    const error = await refusal(zipOf([{ name: 'bcf.version', contents: VERSION_2_1 }, { name: `${TOPIC_GUID}/markup.bcf`, contents: Buffer.alloc(20 * 1024 * 1024) }]));
    expect(error).toBeInstanceOf(PayloadTooLargeError);
    expect(error.message).toMatch(new RegExp(`^The BCF archive was refused: ${TOPIC_GUID}/markup.bcf expands \\d+ times, more than the 200 times`));
  });

  it.each([
    ['too many entries', { maxEntries: 3 }, /it holds 4 files, more than the 3 allowed/],
    ['an entry too large', { maxEntryBytes: 1000 }, /snapshot.png would expand to 2.0 KiB, above the 1000 bytes allowed per file\.$/],
    ['too much in total', { maxTotalBytes: 600 }, /its files would expand to more than 600 bytes in total\.$/],
  ])('a zip bomb: %s', async (_label, limits, message) => {
    const archive = zipOf([
      { name: 'bcf.version', contents: VERSION_2_1 },
      { name: `${TOPIC_GUID}/markup.bcf`, contents: markup21('Open') },
      { name: `${TOPIC_GUID}/viewpoint.bcfv`, contents: '<VisualizationInfo Guid="1c5f7a42-2b7e-4c1a-9d3e-5a6b7c8d9e0f"/>' },
      { name: `${TOPIC_GUID}/snapshot.png`, contents: Buffer.concat([TINY_PNG, Buffer.alloc(2000, 7)]) },
    ]);
    const error = await refusal(archive, { limits });
    expect(error).toBeInstanceOf(PayloadTooLargeError);
    expect(error.message).toMatch(message);
  });

  it('a topic folder without markup, named in the message', async () => {
    const error = await refusal(
      zipOf([
        { name: 'bcf.version', contents: VERSION_2_1 },
        { name: `${TOPIC_GUID}/viewpoint.bcfv`, contents: '<VisualizationInfo Guid="1c5f7a42-2b7e-4c1a-9d3e-5a6b7c8d9e0f"/>' },
      ]),
    );
    expect((error as ValidationError).code).toBe('bcf_missing_markup');
    expect(error.message).toBe(`Topic folder ${TOPIC_GUID} has no markup.bcf; every topic needs one.`);
  });

  it('XML with an external entity (XXE) is refused before parsing', async () => {
    const error = await refusal(zipOf([{ name: 'bcf.version', contents: VERSION_2_1 }, { name: `${TOPIC_GUID}/markup.bcf`, contents: XXE_MARKUP }]));
    expect((error as ValidationError).code).toBe('bcf_unsafe_xml');
    expect(error.message).toBe(
      `${TOPIC_GUID}/markup.bcf contains a document type declaration, which is refused (it could pull in external files).`,
    );
    expect(error.message).not.toContain('root:');
  });

  it('XML with nested internal entities is refused too', async () => {
    const error = await refusal(zipOf([{ name: 'bcf.version', contents: ENTITY_EXPANSION_VERSION }]));
    expect((error as ValidationError).code).toBe('bcf_unsafe_xml');
  });

  it('XML in UTF-16 is refused', async () => {
    const utf16 = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(VERSION_3_0.replace('UTF-8', 'UTF-16'), 'utf16le')]);
    const error = await refusal(zipOf([{ name: 'bcf.version', contents: utf16 }]));
    expect(error.message).toBe('bcf.version is not UTF-8 encoded; BCF files must be UTF-8.');
  });

  it('XML that is not well-formed names the entry and line', async () => {
    const error = await refusal(
      zipOf([
        { name: 'bcf.version', contents: VERSION_2_1 },
        { name: `${TOPIC_GUID}/markup.bcf`, contents: markup21('Open').replace('</Title>', '</Titel>') },
      ]),
    );
    expect((error as ValidationError).code).toBe('bcf_malformed_xml');
    expect(error.message).toMatch(new RegExp(`^${TOPIC_GUID}/markup.bcf is not well-formed XML \\(line 1: `));
  });

  it('a comment without a GUID', async () => {
    const comment = '<Comment><Date>2026-01-06T08:00:00Z</Date><Author>a@example.com</Author><Comment>hi</Comment></Comment>';
    const error = await refusal(zipOf([{ name: 'bcf.version', contents: VERSION_2_1 }, { name: `${TOPIC_GUID}/markup.bcf`, contents: markup21('Open', comment) }]));
    expect(error.message).toBe(`Comment 1 in topic folder ${TOPIC_GUID} has no valid Guid ("").`);
  });
});
