/**
 * `taulens check <model.ifc|.ifczip> --forces <file> --force-unit kN|N|kip|lbf --standard … [--json] [--bcf out.bcf]`:
 * the web shear check of every I-section member of a model against the shear forces of an analysis export, for
 * pipelines (JSON on stdout, exit status) and for people (a table). The forces file is read like an upload (CSV of
 * any delimiter or XLSX); its columns are found by their names, the default format being `member,combination,shear`
 * with an optional `station`, where member is a GlobalId or a Tag.
 *
 * Exit status: 0 when every checked member passes, 1 when any fails, 2 on bad input (the message is on stderr).
 */
import * as fs from 'node:fs';
import { createHash } from 'node:crypto';
import * as os from 'node:os';
import * as path from 'node:path';
import { type CheckParameters, checkParametersSchema } from '../checks/check-parameters';
import { type CheckRunComputation, computeCheckRun, type MemberCheck } from '../checks/check-run-compute';
import { engineVersion } from '../checks/engine-version';
import { governingCheckText } from '../checks/governing-check-text';
import { resultStatusOf } from '../checks/member-result-row';
import { STANDARDS, type Standard } from '../engine/check';
import { type EnYieldRule, GRADE_IDS, type GradeId, isGradeId } from '../engine/grades';
import type { FamilyCheckName, ShearAxis } from '../engine/shear-axis';
import { FORCE_UNITS, type ForceUnit, LENGTH_UNITS, type LengthUnit } from '../engine/units';
import type { ColumnMapping } from '../results/column-mapping';
import { exportBcf } from '../findings/bcf/bcf-export';
import { nameBasedUuid } from '../findings/bcf/bcf-guid';
import type { FindingExport } from '../findings/export/finding-export';
import { memberLabelOf, planRunSync } from '../findings/finding-sync-plan';
import { DomainError } from '../http/errors';
import { extractIfcFromZip } from '../ifc/ifc-archive';
import type { MemberRecord, ModelInfo } from '../ifc/model-read-result';
import { readModel } from '../ifc/read-model';
import { StructuralResultsError } from '../ifc/structural-results';
import { percentText, STANDARD_LABELS } from '../reports/report-format';
import { REPORT_CAUTIONS_TEXT } from '../reports/report-cautions';
import { MEMBER_KEY_KINDS, type MemberKeyKind } from '../results/column-mapping';
import { type GoverningTable, governingShearsByMember } from '../results/governing-shear';
import { type MatchReport, matchResultsToMembers } from '../results/member-matching';
import type { ResultKeySummary } from '../results/result-key-index';
import { ResultsFileError } from '../results/results-file-error';
import { importResultsFile } from '../results/results-import';
import { MOMENT_UNITS, type MomentUnit } from '../results/unit-words';
import { type Command, type CommandIo, optionValue, optionValues, positionals, UsageError } from './command';
import { forcesMapping } from './forces-mapping';
import { importIfcForces, isIfcForcesFile } from './ifc-forces';
import { type ListedMember, listedMember } from './member-listing';

const VALUE_FLAGS = ['--forces', '--mapping', '--force-unit', '--length-unit', '--moment-unit', '--standard', '--sheet', '--member-key', '--default-grade', '--yield-rule', '--bcf'];
const SWITCHES = ['--json'];
/** Options that say how to read a CSV or XLSX file; an IFC analysis model states its own units and members. */
const TABLE_ONLY_FLAGS = ['--mapping', '--force-unit', '--length-unit', '--moment-unit', '--sheet', '--member-key'];
const YIELD_RULES: readonly EnYieldRule[] = ['en10025-2', 'en1993-1-1-table-3.1'];
/** Unmatched force keys listed on stderr before "and N more". */
const LISTED_KEYS = 10;
/** Namespace of the BCF topic GUIDs this command derives from the model and member, so a re-export keeps them. */
const TOPIC_NAMESPACE = '6f1d3c52-8a4e-4b7f-9c21-3e5a7d90b4c8';

const USAGE = `usage: taulens check <model.ifc | model.ifczip> --forces <forces.csv | forces.xlsx | analysis.ifc> [--mapping <mapping.json>]
                     --force-unit ${FORCE_UNITS.join('|')} --standard ${STANDARDS.join('|')}
                     [--json] [--bcf out.bcf] [--length-unit ${LENGTH_UNITS.join('|')}]
                     [--moment-unit ${MOMENT_UNITS.join('|')}] [--sheet <name> …]
                     [--member-key ${MEMBER_KEY_KINDS.join('|')}] [--default-grade ${GRADE_IDS.join('|')}]
                     [--yield-rule ${YIELD_RULES.join('|')}]

Checks every steel section of the model (I, channel, tee, box, tube; angles by AISC G3) for the forces of an
analysis export: the major-axis shear (Vz) with the My at its station, the minor-axis shear (Vy) with the Mz at its
station, and shear with bending (EN 1993-1-1 §6.2.8 / EN 1993-1-5 §7.1; by AISC 360-22 shear and flexure side by
side), with the elastic shear stress τ = VQ/(It) reported beside, by AISC 360-22 chapter G (LRFD or ASD) or
EN 1993-1-1 §6.2.6 with EN 1993-1-5 §5, with the code's recommended factors.

The forces file is CSV (any delimiter) or XLSX. Its header names the columns; the default format is
  member,combination,shear          (optionally station)
where member is the GlobalId or the Tag of the IFC member (Name also matches). Usual export names are recognised
(station: x, pos, position, station, dist, distance, location, s; shear along the web: shear, V, Vz, Fz, Q; Vy, My,
Mz; load case; envelope max/min), as are one column per combination and units in brackets or in a units row. When
the columns cannot be told apart for certain the command stops and prints the mapping to write for --mapping.
Each member takes, per combination, the largest |shear| over its stations.

The forces may also be an IFC4 or IFC4X3 structural analysis model (.ifc or .ifczip; the model file itself when it
holds its analysis): the internal forces of each analysis member (IfcStructuralCurveMember) in each result group
(IfcStructuralResultGroup, one per combination) at their stations, in the file's own units, Vz along the member's
local z axis. An analysis member counts for the beam, column or member it is assigned to, else for the one whose axis
it lies on (within 250 mm). The options that describe a CSV or XLSX file (--mapping, --force-unit, --length-unit,
--moment-unit, --sheet, --member-key) do not apply to it.

  --forces          the shear forces file, or the IFC analysis model (required)
  --mapping         a column mapping (JSON, the format of a saved web mapping template) instead of detection
  --force-unit      unit of the shear column (required unless the header or the mapping says it, e.g. 'V [kN]')
  --standard        the design code (required)
  --json            print {model, cautions, standard, …, unmatchedForces, members:[…]} as JSON instead of a table
  --bcf out.bcf     also write one BCF 2.1 topic per failing member
  --length-unit     unit of the station column (default mm)
  --moment-unit     unit of the moment columns, when the header does not say it (else they are not read)
  --sheet           the worksheet of an XLSX file with several; repeat it to read several sheets alike
  --member-key      what the member column holds (default auto: GlobalId, then Tag, then Name)
  --default-grade   grade for members whose material names none (default S355 for EN, A992 for AISC)
  --yield-rule      EN yield strength by thickness: EN 10025-2 bands (default) or EN 1993-1-1 Table 3.1

Per member, status is 'pass', 'fail', 'not-checked' (no forces, or no usable section) or 'not-applicable' (no shear
rule for its section); profile.family names the section's family; governing gives the axis and check with the highest
utilisation, its combination and the station (m) of its shear; checks lists the governing result of each axis and
check the forces allowed (a member without Vy is checked for what it has; reason says what was left out).
Exit status: 0 every checked member passes, 1 any member fails, 2 bad input (the message is on stderr).`;

interface CheckArguments {
  model: string;
  forces: string;
  mappingFile?: string;
  forceUnit?: ForceUnit;
  lengthUnit?: LengthUnit;
  momentUnit?: MomentUnit;
  standard: Standard;
  sheets: string[];
  memberKey?: MemberKeyKind;
  defaultGrade?: GradeId;
  yieldRule: EnYieldRule;
  json: boolean;
  bcf?: string;
  /** The forces are an IFC structural analysis model, not a table. */
  ifcForces: boolean;
}

function oneOf<T extends string>(flag: string, value: string | undefined, allowed: readonly T[]): T | undefined {
  if (value === undefined) return undefined;
  if (!allowed.includes(value as T)) throw new UsageError(`${flag} must be one of ${allowed.join(', ')}, got '${value}'`);
  return value as T;
}

function parse(args: readonly string[]): CheckArguments {
  const unknown = args.filter((a) => a.startsWith('--') && !VALUE_FLAGS.includes(a) && !SWITCHES.includes(a));
  if (unknown.length > 0) throw new UsageError(`unknown option ${unknown[0]}`);
  const files = positionals(args, VALUE_FLAGS);
  if (files.length !== 1) throw new UsageError(files.length === 0 ? 'give the model file to check' : `one model file at a time, got ${files.length}`);
  const forces = optionValue(args, '--forces');
  if (!forces) throw new UsageError('--forces <file> is required: the shear forces of the analysis');
  const standard = oneOf('--standard', optionValue(args, '--standard'), STANDARDS);
  if (!standard) throw new UsageError(`--standard is required: one of ${STANDARDS.join(', ')}`);
  const defaultGrade = optionValue(args, '--default-grade');
  if (defaultGrade !== undefined && !isGradeId(defaultGrade)) throw new UsageError(`--default-grade must be one of ${GRADE_IDS.join(', ')}, got '${defaultGrade}'`);
  const mappingFile = optionValue(args, '--mapping');
  for (const file of [files[0], forces, ...(mappingFile ? [mappingFile] : [])]) {
    if (!fs.existsSync(file) || !fs.statSync(file).isFile()) throw new UsageError(`no such file: ${file}`);
  }
  const ifcForces = isIfcForcesFile(forces);
  const tableOnly = ifcForces && TABLE_ONLY_FLAGS.find((flag) => args.includes(flag));
  if (tableOnly) throw new UsageError(`${tableOnly} describes a CSV or XLSX forces file; ${forces} is an IFC analysis model, which states its own units and members`);
  return {
    model: files[0],
    forces,
    mappingFile,
    forceUnit: oneOf('--force-unit', optionValue(args, '--force-unit'), FORCE_UNITS),
    lengthUnit: oneOf('--length-unit', optionValue(args, '--length-unit'), LENGTH_UNITS),
    momentUnit: oneOf('--moment-unit', optionValue(args, '--moment-unit'), MOMENT_UNITS),
    standard,
    sheets: optionValues(args, '--sheet'),
    memberKey: oneOf('--member-key', optionValue(args, '--member-key'), MEMBER_KEY_KINDS),
    defaultGrade,
    yieldRule: oneOf('--yield-rule', optionValue(args, '--yield-rule'), YIELD_RULES) ?? 'en10025-2',
    json: args.includes('--json'),
    bcf: optionValue(args, '--bcf'),
    ifcForces,
  };
}

function isZip(file: string): boolean {
  const fd = fs.openSync(file, 'r');
  try {
    const magic = Buffer.alloc(4);
    return fs.readSync(fd, magic, 0, 4, 0) === 4 && magic.readUInt32LE(0) === 0x04034b50;
  } finally {
    fs.closeSync(fd);
  }
}

/** Forces read from either source, in the shape the check takes, with what --json says of them. */
interface ReadForces {
  memberKeys: ResultKeySummary[];
  governing: GoverningTable;
  keyKind: MemberKeyKind;
  description: Record<string, unknown>;
}

/** A CSV or XLSX forces file, read before the model so a bad file stops the command early. */
async function tableForces(options: CheckArguments): Promise<ReadForces> {
  const mapping: ColumnMapping = await forcesMapping(options);
  const { summary, governing } = await importResultsFile(options.forces, mapping, mapping.sheets ? undefined : options.sheets[0]);
  return {
    memberKeys: summary.memberKeys,
    governing,
    keyKind: mapping.memberKeyKind,
    description: { rows: summary.rowCount, keys: summary.memberKeys.length, combinations: summary.combinations, forceUnit: mapping.forceUnit, mapping },
  };
}

/** An IFC analysis model's forces, linked to the members already read (whose axes place unassigned analysis members). */
async function analysisForces(options: CheckArguments, records: readonly MemberRecord[], scratch: string): Promise<ReadForces> {
  let ifc = options.forces;
  if (isZip(ifc)) {
    ifc = path.join(scratch, 'forces.ifc');
    await extractIfcFromZip(options.forces, ifc);
  }
  const forces = await importIfcForces(ifc, records);
  return {
    memberKeys: forces.memberKeys,
    governing: forces.governing,
    keyKind: 'globalId',
    description: {
      source: 'ifc-analysis-model',
      rows: forces.rowCount,
      keys: forces.memberKeys.length,
      combinations: forces.combinations,
      analysisMemberLinks: forces.links,
      stationsWithoutShear: forces.stationsWithoutShear,
    },
  };
}

async function readMembers(options: CheckArguments, parameters: CheckParameters, scratch: string): Promise<{ model: ModelInfo; members: MemberRecord[] }> {
  let ifc = options.model;
  if (isZip(ifc)) {
    ifc = path.join(scratch, 'model.ifc');
    await extractIfcFromZip(options.model, ifc);
  }
  const yieldRule = parameters.standard === 'en1993-1-1' ? parameters.yieldRule : options.yieldRule;
  const { model, members } = await readModel(ifc, { fileName: path.basename(options.model), glb: 'none', defaultGrade: parameters.defaultGrade, yieldRule });
  return { model, members };
}

/** One check's governing values as --json prints them: forces in kN and kNm, stations in m. */
interface PrintedCheck {
  axis: ShearAxis;
  check: FamilyCheckName;
  combination: string;
  station_m: number | null;
  VEd_kN: number;
  /** The moment at the shear's station, for 'shear with bending'; null otherwise. */
  MEd_kNm: number | null;
  VRd_kN: number;
  utilisation: number;
}

interface CheckedMember extends Omit<ListedMember, 'status'> {
  status: MemberCheck['status'];
  governing:
    | (PrintedCheck & { tauMax_MPa: number; tauAvgWeb_MPa: number })
    | null;
  /** The governing result per axis and check the member was checked for. */
  checks: PrintedCheck[];
}

const metres = (station_mm: number | undefined): number | null => (station_mm === undefined ? null : station_mm / 1000);

function checkedMember(record: MemberRecord, check: MemberCheck): CheckedMember {
  const listed = listedMember(record);
  const governing = check.governing;
  const reason = check.reason ?? listed.reason;
  return {
    ...listed,
    status: check.status,
    ...(reason ? { reason } : {}),
    flags: [...new Set([...listed.flags, ...check.flags])],
    governing: governing && {
      axis: governing.axis ?? 'major',
      check: governing.check ?? 'major-axis shear',
      combination: governing.combination,
      station_m: metres(governing.station_mm),
      VEd_kN: governing.VEd_N / 1000,
      MEd_kNm: governing.check === 'shear with bending' && governing.MEd_Nmm !== undefined ? governing.MEd_Nmm / 1e6 : null,
      VRd_kN: governing.VRd_N / 1000,
      utilisation: governing.utilisation,
      tauMax_MPa: governing.tauMax_MPa,
      tauAvgWeb_MPa: governing.tauAvgWeb_MPa,
    },
    checks: (check.checks ?? []).map((c) => ({
      axis: c.axis,
      check: c.check,
      combination: c.combination,
      station_m: metres(c.station_mm),
      VEd_kN: c.VEd_N / 1000,
      MEd_kNm: c.MEd_Nmm === null ? null : c.MEd_Nmm / 1e6,
      VRd_kN: c.VRd_N / 1000,
      utilisation: c.utilisation,
    })),
  };
}

function sha256Of(file: string): string {
  return createHash('sha256').update(fs.readFileSync(file)).digest('hex');
}

/** One topic per failing member, worded as the server's generated findings are. */
function failureFindings(records: readonly MemberRecord[], run: CheckRunComputation, context: { modelSha256: string; standard: Standard; forcesFile: string }): FindingExport[] {
  const results = run.members.map((check, i) => ({
    globalId: check.globalId,
    tag: records[i].tag,
    name: records[i].name,
    storey: records[i].storey,
    profileName: records[i].profile?.name ?? null,
    status: resultStatusOf(check),
    utilisation: check.governing?.utilisation ?? null,
    VEd_kN: check.governing ? check.governing.VEd_N / 1000 : null,
    VRd_kN: check.governing ? check.governing.VRd_N / 1000 : null,
    governingCombination: check.governing?.combination ?? null,
    governingCheck: governingCheckText(check.governing?.axis ?? 'major', check.governing?.check ?? 'major-axis shear'),
    flags: check.flags,
  }));
  const byGlobalId = new Map(results.map((result) => [result.globalId, result]));
  const createdAt = new Date().toISOString();
  return planRunSync({ runId: 'cli', revisionNumber: 1 }, results, [])
    .create.filter((draft) => draft.kind === 'web-shear-fail')
    .map((draft, i): FindingExport => {
      const result = byGlobalId.get(draft.globalId)!;
      return {
        id: `F-${i + 1}`,
        guid: nameBasedUuid(TOPIC_NAMESPACE, `${context.modelSha256}/${draft.globalId}`),
        kind: 'failure',
        title: draft.title,
        description:
          `${percentText(result.utilisation!)} utilisation in ${result.governingCheck} under ${result.governingCombination} ` +
          `(VEd ${Math.abs(result.VEd_kN!).toFixed(1)} kN, VRd ${result.VRd_kN!.toFixed(1)} kN) by ${STANDARD_LABELS[context.standard]}, ` +
          `forces from ${path.basename(context.forcesFile)}. ${REPORT_CAUTIONS_TEXT}`,
        status: 'open',
        priority: draft.priority,
        labels: ['web shear', result.governingCheck!],
        createdAt,
        createdBy: 'taulens-check@localhost',
        comments: [],
        memberGlobalIds: [draft.globalId],
        memberLabel: memberLabelOf(result),
        utilisation: result.utilisation!,
      };
    });
}

function warnAboutMatching(report: MatchReport, model: ModelInfo, io: CommandIo): void {
  if (report.likelyOtherModel) {
    io.err(
      `taulens check: WARNING: only ${report.counts.matched} of ${report.counts.keys} force keys match a member of ${model.fileName}. ` +
        'These forces are probably for another model; the results below check almost nothing.\n',
    );
  }
  const unmatched = report.unmatchedKeys.concat(report.ambiguous.map((match) => match.memberKey));
  if (unmatched.length > 0) {
    const listed = unmatched.slice(0, LISTED_KEYS).join(', ');
    const more = unmatched.length > LISTED_KEYS ? ` and ${unmatched.length - LISTED_KEYS} more` : '';
    io.err(`taulens check: ${unmatched.length} force key(s) match no single member: ${listed}${more}.\n`);
  }
}

function table(model: ModelInfo, standard: Standard, members: readonly CheckedMember[], run: CheckRunComputation): string {
  const header = ['GlobalId'.padEnd(22), 'Tag'.padEnd(10), 'Profile'.padEnd(16), 'Status'.padEnd(14), 'Combination'.padEnd(14), 'Check'.padEnd(32), 'At m'.padStart(7), 'VEd kN'.padStart(9), 'VRd kN'.padStart(9), 'Util.'.padStart(8)];
  const lines = [`${model.fileName}: shear on both axes and shear with bending by ${STANDARD_LABELS[standard]}`, '', header.join('  '), header.map((h) => '-'.repeat(h.length)).join('  ')];
  for (const member of members) {
    const g = member.governing;
    lines.push(
      [
        member.globalId.padEnd(22),
        (member.tag ?? '').slice(0, 10).padEnd(10),
        (member.profile?.name ?? '').slice(0, 16).padEnd(16),
        member.status.padEnd(14),
        (g?.combination ?? '').slice(0, 14).padEnd(14),
        (g ? governingCheckText(g.axis, g.check)! : '').padEnd(32),
        (g?.station_m != null ? g.station_m.toFixed(2) : '').padStart(7),
        (g ? Math.abs(g.VEd_kN).toFixed(1) : '').padStart(9),
        (g ? g.VRd_kN.toFixed(1) : '').padStart(9),
        (g ? percentText(g.utilisation) : '').padStart(8),
      ]
        .join('  ')
        .trimEnd(),
    );
  }
  const s = run.summary;
  lines.push('', `${s.members} members: ${s.pass} pass (${s.warnings} near the limit), ${s.fail} fail, ${s.notChecked} not checked, ${s.notApplicable} not applicable.`, '', REPORT_CAUTIONS_TEXT);
  return lines.join('\n') + '\n';
}

async function run(args: readonly string[], io: CommandIo): Promise<number> {
  const options = parse(args);
  const parameters = checkParametersSchema.parse({ standard: options.standard, ...(options.defaultGrade && { defaultGrade: options.defaultGrade }), ...(options.standard === 'en1993-1-1' && { yieldRule: options.yieldRule }) });
  const scratch = fs.mkdtempSync(path.join(os.tmpdir(), 'taulens-check-'));
  try {
    const fromTable = options.ifcForces ? undefined : await tableForces(options);
    const { model, members: records } = await readMembers(options, parameters, scratch);
    const forces = fromTable ?? (await analysisForces(options, records, scratch));
    const report = matchResultsToMembers(forces.memberKeys, records, { keyKind: forces.keyKind });
    warnAboutMatching(report, model, io);
    const computed = computeCheckRun({ members: records, shears: governingShearsByMember(forces.governing, report.matched), parameters });
    const members = records.map((record, i) => checkedMember(record, computed.members[i]));
    if (options.bcf) {
      const modelSha256 = sha256Of(options.model);
      const findings = failureFindings(records, computed, { modelSha256, standard: options.standard, forcesFile: options.forces });
      const bcf = await exportBcf(findings, { version: '2.1', project: { id: nameBasedUuid(TOPIC_NAMESPACE, modelSha256), name: model.fileName }, modelFiles: [{ fileName: model.fileName ?? path.basename(options.model) }] });
      fs.writeFileSync(`${options.bcf}.part`, bcf);
      fs.renameSync(`${options.bcf}.part`, options.bcf);
    }
    if (options.json) {
      const output = {
        model,
        cautions: REPORT_CAUTIONS_TEXT,
        standard: options.standard,
        parameters,
        engineVersion: engineVersion(),
        forces: { fileName: path.basename(options.forces), sha256: sha256Of(options.forces), ...forces.description },
        summary: computed.summary,
        unmatchedForces: report.unmatchedKeys,
        ambiguousForces: report.ambiguous.map((match) => ({ key: match.memberKey, candidates: match.candidates })),
        members,
      };
      io.out(JSON.stringify(output, null, 2) + '\n');
    } else {
      io.out(table(model, options.standard, members, computed));
    }
    return computed.summary.fail > 0 ? 1 : 0;
  } catch (error) {
    if (error instanceof ResultsFileError) {
      const rows = (error.details.issues ?? []).slice(0, LISTED_KEYS).map((issue) => `\n  ${issue.message}`).join('');
      io.err(`taulens check: ${options.forces}: ${error.message}${rows}\n`);
      return 2;
    }
    if (error instanceof StructuralResultsError) {
      io.err(`taulens check: ${options.forces}: ${error.message}\n`);
      return 2;
    }
    if (error instanceof DomainError) {
      io.err(`taulens check: ${error.message}\n`);
      return 2;
    }
    throw error;
  } finally {
    fs.rmSync(scratch, { recursive: true, force: true });
  }
}

export const checkCommand: Command = {
  name: 'check',
  summary: 'check the webs of a model for the shear forces of an analysis export',
  usage: USAGE,
  run,
};
