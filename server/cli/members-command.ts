/**
 * `taulens members <model.ifc|model.ifczip> [--json] [--glb out.glb]`: the model's beams, columns and members with
 * their sections, for people (a table) or for model-exchange pipelines (JSON on stdout).
 */
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { type EnYieldRule, GRADE_IDS, isGradeId } from '../engine/grades';
import { extractIfcFromZip } from '../ifc/ifc-archive';
import { IfcReadError } from '../ifc/ifc-read-error';
import { readModel } from '../ifc/read-model';
import { REPORT_CAUTIONS_TEXT } from '../reports/report-cautions';
import { type Command, type CommandIo, optionValue, positionals, UsageError } from './command';
import { listedMember, memberTable } from './member-listing';

const VALUE_FLAGS = ['--glb', '--default-grade', '--yield-rule'];
const SWITCHES = ['--json'];
const YIELD_RULES: readonly EnYieldRule[] = ['en10025-2', 'en1993-1-1-table-3.1'];

const USAGE = `usage: taulens members <model.ifc | model.ifczip> [--json] [--glb out.glb]
                       [--default-grade ${GRADE_IDS.join('|')}] [--yield-rule ${YIELD_RULES.join('|')}]

Lists every IfcBeam, IfcColumn and IfcMember of the model with its section (from the file, or from the section
catalogue for a profile known only by name), fabrication, material grade and yield strength, storey and length.

  --json            print {model, cautions, members:[…]} as JSON instead of a table
  --glb out.glb     also write the model's geometry as glTF binary (one node per element, named by GlobalId)
  --default-grade   grade for members whose material names none (default S355); such members carry 'assumed-grade'
  --yield-rule      EN yield strength by thickness: EN 10025-2 bands (default) or EN 1993-1-1 Table 3.1

Status is 'ok' or 'not-applicable' (with a reason). Members that should be checked but could not be read fully are
listed as 'not-applicable' with the flag 'needs-review' and the reason.
Exit status: 0 done, 2 bad input (the message is on stderr).`;

interface MembersArguments {
  file: string;
  json: boolean;
  glb?: string;
  defaultGrade: (typeof GRADE_IDS)[number];
  yieldRule: EnYieldRule;
}

function parse(args: readonly string[]): MembersArguments {
  const unknown = args.filter((a) => a.startsWith('--') && !VALUE_FLAGS.includes(a) && !SWITCHES.includes(a));
  if (unknown.length > 0) throw new UsageError(`unknown option ${unknown[0]}`);
  const files = positionals(args, VALUE_FLAGS);
  if (files.length !== 1) throw new UsageError(files.length === 0 ? 'give the model file to read' : `one model file at a time, got ${files.length}`);
  const defaultGrade = optionValue(args, '--default-grade') ?? 'S355';
  if (!isGradeId(defaultGrade)) throw new UsageError(`--default-grade must be one of ${GRADE_IDS.join(', ')}`);
  const yieldRule = (optionValue(args, '--yield-rule') ?? 'en10025-2') as EnYieldRule;
  if (!YIELD_RULES.includes(yieldRule)) throw new UsageError(`--yield-rule must be one of ${YIELD_RULES.join(', ')}`);
  return { file: files[0], json: args.includes('--json'), glb: optionValue(args, '--glb'), defaultGrade, yieldRule };
}

function isZip(file: string): boolean {
  const fd = fs.openSync(file, 'r');
  try {
    const magic = Buffer.alloc(4);
    fs.readSync(fd, magic, 0, 4, 0);
    return magic.readUInt32LE(0) === 0x04034b50;
  } finally {
    fs.closeSync(fd);
  }
}

async function run(args: readonly string[], io: CommandIo): Promise<number> {
  const options = parse(args);
  if (!fs.existsSync(options.file) || !fs.statSync(options.file).isFile()) throw new IfcReadError('unreadable', `There is no file ${options.file}.`);
  const scratch = fs.mkdtempSync(path.join(os.tmpdir(), 'taulens-members-'));
  try {
    let ifcPath = options.file;
    if (isZip(options.file)) {
      ifcPath = path.join(scratch, 'model.ifc');
      await extractIfcFromZip(options.file, ifcPath);
    }
    const result = await readModel(ifcPath, {
      fileName: path.basename(options.file),
      glb: options.glb ? { path: options.glb } : 'none',
      defaultGrade: options.defaultGrade,
      yieldRule: options.yieldRule,
    });
    const members = result.members.map(listedMember);
    if (options.json) io.out(JSON.stringify({ model: result.model, cautions: REPORT_CAUTIONS_TEXT, members }, null, 2) + '\n');
    else io.out(memberTable(result.model, members, REPORT_CAUTIONS_TEXT));
    return 0;
  } finally {
    fs.rmSync(scratch, { recursive: true, force: true });
  }
}

export const membersCommand: Command = {
  name: 'members',
  summary: 'list the beams, columns and members of an IFC model with their sections',
  usage: USAGE,
  run,
};
