/**
 * The column mapping of `taulens check`: read from `--mapping FILE.json` (the format of a saved web template, which
 * the web downloads from …/result-mappings/:templateId/download), or detected from the forces file's header as the
 * web import detects it. Detection that is unsure, or that finds no column for a role, stops with one message: the
 * questions, and the mapping to write and pass with `--mapping`.
 */
import * as fs from 'node:fs';
import * as path from 'node:path';
import type { ForceUnit, LengthUnit } from '../engine/units';
import { ValidationError } from '../http/errors';
import { type ColumnMapping, columnMappingSchema, type MappingGuess, type MemberKeyKind, parseColumnMapping } from '../results/column-mapping';
import { ResultsFileError } from '../results/results-file-error';
import { previewResultsFile } from '../results/results-preview';
import { MOMENT_UNITS, type MomentUnit } from '../results/unit-words';
import { FORCE_UNITS, LENGTH_UNITS } from '../engine/units';
import { UsageError } from './command';

export interface MappingOptions {
  forces: string;
  mappingFile?: string;
  sheets: string[];
  forceUnit?: ForceUnit;
  lengthUnit?: LengthUnit;
  momentUnit?: MomentUnit;
  memberKey?: MemberKeyKind;
}

/** The mapping to import the forces with; the sheet to read when the mapping names none. */
export async function forcesMapping(options: MappingOptions): Promise<ColumnMapping> {
  return options.mappingFile ? mappingFromFile(options.mappingFile, options) : detectedMapping(options);
}

/** Options given beside a mapping file fill what it leaves out; one that contradicts it is refused. */
function mappingFromFile(file: string, options: MappingOptions): ColumnMapping {
  let json: unknown;
  try {
    json = JSON.parse(fs.readFileSync(file, 'utf8'));
  } catch (error) {
    throw new UsageError(`--mapping ${file} is not a JSON file: ${error instanceof Error ? error.message : String(error)}`);
  }
  // A template as the web lists it ({id, name, mapping, …}) holds the mapping under `mapping`.
  const given = isObject(json) && isObject(json.mapping) && !('memberColumn' in json) ? json.mapping : json;
  if (!isObject(given)) throw new UsageError(`--mapping ${file} must hold a JSON object (see 'Command line' in the README)`);
  const fromOptions: Record<string, unknown> = {
    forceUnit: options.forceUnit,
    lengthUnit: options.lengthUnit,
    momentUnit: options.momentUnit,
    memberKeyKind: options.memberKey,
    sheets: options.sheets.length > 1 ? options.sheets : undefined,
  };
  const merged: Record<string, unknown> = { ...given };
  for (const [field, value] of Object.entries(fromOptions)) {
    if (value === undefined) continue;
    if (merged[field] !== undefined && JSON.stringify(merged[field]) !== JSON.stringify(value)) {
      throw new UsageError(`the option for ${field} (${JSON.stringify(value)}) contradicts the mapping file's ${JSON.stringify(merged[field])}; give only one`);
    }
    merged[field] = value;
  }
  try {
    return parseColumnMapping(merged);
  } catch (error) {
    if (error instanceof ResultsFileError) throw new ValidationError(`${file}: ${error.message}`, { code: error.code });
    throw error;
  }
}

async function detectedMapping(options: MappingOptions): Promise<ColumnMapping> {
  const severalSheets = options.sheets.length > 1;
  const { headers, guess } = await previewResultsFile(options.forces, { sheet: options.sheets[0], rowLimit: 1, severalSheets });
  const proposal: Partial<ColumnMapping> = {
    ...guess.mapping,
    ...(severalSheets && { sheets: options.sheets }),
    ...(options.memberKey && { memberKeyKind: options.memberKey }),
    forceUnit: options.forceUnit ?? guess.mapping.forceUnit,
    lengthUnit: guess.mapping.lengthUnit ?? options.lengthUnit ?? 'mm',
    momentUnit: options.momentUnit ?? guess.mapping.momentUnit,
  };
  if (!guess.mapping.stationColumn && !guess.mapping.endColumns) delete proposal.lengthUnit;
  const missingColumns = guess.missing.filter((field) => field.endsWith('Column'));
  if (missingColumns.length > 0 || guess.unsure.length > 0) throw mappingAdvice(options.forces, headers, guess, proposal);
  if (!proposal.forceUnit) {
    throw new UsageError(`--force-unit is required: the header does not say the unit of '${proposal.shearColumn ?? proposal.combinationColumns![0]}'`);
  }
  // Moments are read for the checks of shear with bending, not the web shear check: without a unit they are left out.
  if (!proposal.momentUnit) {
    delete proposal.majorMomentColumn;
    delete proposal.minorMomentColumn;
  }
  return parseColumnMapping(proposal);
}

const PLACEHOLDERS: Partial<Record<keyof ColumnMapping, string>> = {
  forceUnit: `<${FORCE_UNITS.join('|')}>`,
  lengthUnit: `<${LENGTH_UNITS.join('|')}>`,
  momentUnit: `<${MOMENT_UNITS.join('|')}>`,
};

/** One message: what is missing or unsure, then the mapping to write, with placeholders where nothing could be proposed. */
function mappingAdvice(forces: string, headers: readonly string[], guess: MappingGuess, proposal: Partial<ColumnMapping>): ValidationError {
  const lines: string[] = [];
  const missingColumns = guess.missing.filter((field) => field.endsWith('Column'));
  if (missingColumns.length > 0) {
    const names = missingColumns.map((field) => field.replace('Column', '')).join(', ');
    lines.push(`the forces file has no ${names} column (its columns: ${headers.join(', ')}).`);
  } else {
    lines.push(`the columns of ${path.basename(forces)} cannot be told apart for certain:`);
  }
  for (const question of guess.unsure) lines.push(`  ${question.field}: ${question.columns.map((column) => `'${column}'`).join(', ')}: ${question.why}.`);
  const written: Record<string, unknown> = {};
  for (const field of Object.keys(columnMappingSchema.shape) as Array<keyof ColumnMapping>) {
    const value = proposal[field] ?? (guess.missing.includes(field as never) ? (PLACEHOLDERS[field] ?? '<column>') : undefined);
    if (value !== undefined) written[field] = value;
  }
  lines.push(
    'Write this mapping to a file, correct what is wrong (the README\'s "Command line" section lists every field), and run again with --mapping FILE.json:',
    JSON.stringify(written, null, 2),
  );
  return new ValidationError(lines.join('\n'), { code: 'mapping_unsure' });
}

function isObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}
