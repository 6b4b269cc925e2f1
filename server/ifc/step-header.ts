/**
 * Checks that bytes are an IFC file in STEP physical-file form (ISO 10303-21) before web-ifc sees them: web-ifc
 * accepts almost anything, so an empty, foreign or cut-off file must be caught here with a message a person can act on.
 * Only the head and the tail of the file are needed, so an upload can be checked without reading it whole.
 */
import { IfcReadError } from './ifc-read-error';
import type { IfcSchema } from './model-read-result';

/** How much of the start of the file holds the whole header (headers are a few hundred bytes in practice). */
export const HEADER_PROBE_BYTES = 256 * 1024;
/** How much of the end of the file must contain the closing keyword. */
export const TAIL_PROBE_BYTES = 4096;

const SCHEMAS: Readonly<Record<string, IfcSchema>> = {
  IFC2X3: 'IFC2X3',
  IFC4: 'IFC4',
  IFC4X3: 'IFC4X3',
  IFC4X3_ADD2: 'IFC4X3',
};
export const SUPPORTED_SCHEMAS = Object.keys(SCHEMAS);

/**
 * Pre-release names of IFC 4.3 that exporters still write (release candidates, the first addendum): read as IFC4X3,
 * whose entities they share for everything a steel member uses, and flagged so the user knows.
 */
const IFC4X3_PRE_RELEASE = /^IFC4X3_(RC[1-4]|ADD1)$/;

export interface StepHeader {
  /** Schema name as written in FILE_SCHEMA. */
  fileSchema: string;
  schema: IfcSchema;
  fileName?: string;
  /** FILE_NAME's originating system, else its preprocessor version. */
  application?: string;
  /** A pre-release schema name (e.g. IFC4X3_RC2) read as `schema`. */
  readAs?: true;
}

type HeaderValue = string | null | HeaderValue[];

/** Decodes STEP string escapes: '' , \\ , \S\c (ISO 8859 upper half), \X\hh (8-bit) and \X2\…\X0\ (UTF-16). */
export function decodeStepString(raw: string): string {
  return raw
    .replace(/''/g, "'")
    .replace(/\\X2\\((?:[0-9A-Fa-f]{4})+)\\X0\\/g, (_m, hex: string) =>
      String.fromCharCode(...(hex.match(/.{4}/g) ?? []).map((h) => parseInt(h, 16))),
    )
    .replace(/\\X\\([0-9A-Fa-f]{2})/g, (_m, hex: string) => String.fromCharCode(parseInt(hex, 16)))
    .replace(/\\S\\(.)/g, (_m, c: string) => String.fromCharCode(c.charCodeAt(0) + 128))
    .replace(/\\\\/g, '\\');
}

/** Parses the argument list of one header entity, starting just after its opening parenthesis. */
function parseArguments(text: string, start: number): { values: HeaderValue[]; end: number } {
  const values: HeaderValue[] = [];
  let i = start;
  while (i < text.length) {
    const c = text[i];
    if (c === ')') return { values, end: i + 1 };
    if (c === '(') {
      const inner = parseArguments(text, i + 1);
      values.push(inner.values);
      i = inner.end;
    } else if (c === "'") {
      let j = i + 1;
      while (j < text.length && !(text[j] === "'" && text[j + 1] !== "'")) j += text[j] === "'" ? 2 : 1;
      values.push(decodeStepString(text.slice(i + 1, j)));
      i = j + 1;
    } else if (c === '$' || c === '*') {
      values.push(null);
      i++;
    } else if (c === ',' || /\s/.test(c)) {
      i++;
    } else {
      // An enumeration, number or typed value we do not need: skip to the next separator.
      while (i < text.length && !/[,)]/.test(text[i])) i++;
      values.push(null);
    }
  }
  throw new IfcReadError('not-step', 'The STEP header has an unclosed parenthesis.');
}

function headerEntity(header: string, keyword: string): HeaderValue[] | undefined {
  const match = new RegExp(`\\b${keyword}\\s*\\(`).exec(header);
  return match ? parseArguments(header, match.index + match[0].length).values : undefined;
}

function firstString(value: HeaderValue | undefined): string | undefined {
  if (typeof value === 'string') return value || undefined;
  if (Array.isArray(value)) return firstString(value[0]);
  return undefined;
}

const latin1 = new TextDecoder('latin1');

/** Removes comments so that keywords inside them are not found. */
function withoutComments(text: string): string {
  return text.replace(/\/\*[\s\S]*?\*\//g, ' ');
}

/**
 * Reads and checks the header. `head` is the start of the file (up to HEADER_PROBE_BYTES), `tail` its last bytes (up
 * to TAIL_PROBE_BYTES), `totalBytes` the file size. Throws IfcReadError for anything that is not a complete IFC file
 * of a supported schema.
 */
export function readStepHeader(head: Uint8Array, tail: Uint8Array, totalBytes: number): StepHeader {
  if (totalBytes === 0) throw new IfcReadError('empty-file', 'The file is empty (0 bytes).');
  if (head[0] === 0x50 && head[1] === 0x4b && head[2] === 0x03 && head[3] === 0x04) {
    throw new IfcReadError('not-step', 'The file is a zip archive, not an IFC text file; give it the .ifczip extension.');
  }
  const text = latin1.decode(head).replace(/^\uFEFF|^\u00EF\u00BB\u00BF/, '');
  const start = text.search(/\S/);
  if (start < 0) throw new IfcReadError('empty-file', 'The file contains only blank space.');
  if (!text.startsWith('ISO-10303-21;', start)) {
    throw new IfcReadError('not-step', 'This is not an IFC file: an IFC (STEP) file starts with "ISO-10303-21;".');
  }
  const body = withoutComments(text.slice(start));
  const headerStart = body.indexOf('HEADER;');
  const headerEnd = body.indexOf('ENDSEC;', headerStart);
  if (headerStart < 0 || headerEnd < 0) {
    const problem = totalBytes <= head.byteLength ? 'ends inside its HEADER section' : 'has no complete HEADER section at its start';
    throw new IfcReadError(totalBytes <= head.byteLength ? 'truncated' : 'not-step', `The IFC file ${problem}.`);
  }
  if (!/END-ISO-10303-21;\s*$/.test(withoutComments(latin1.decode(tail)))) {
    throw new IfcReadError(
      'truncated',
      'The IFC file is incomplete: it does not end with "END-ISO-10303-21;". It was probably cut off during export or upload.',
    );
  }
  if (totalBytes <= head.byteLength && body.indexOf('DATA;', headerEnd) < 0) {
    throw new IfcReadError('not-step', 'The IFC file has no DATA section, so it holds no model.');
  }
  const header = body.slice(headerStart, headerEnd);
  const fileSchema = firstString(headerEntity(header, 'FILE_SCHEMA'))?.trim().toUpperCase();
  if (!fileSchema) throw new IfcReadError('unknown-schema', 'The IFC header names no schema (FILE_SCHEMA is missing or empty).');
  const readAs = IFC4X3_PRE_RELEASE.test(fileSchema);
  const schema = readAs ? 'IFC4X3' : SCHEMAS[fileSchema];
  if (!schema) {
    throw new IfcReadError(
      'unknown-schema',
      `The IFC schema "${fileSchema}" is not supported; supported schemas: ${SUPPORTED_SCHEMAS.join(', ')}.`,
    );
  }
  const fileName = headerEntity(header, 'FILE_NAME');
  return {
    fileSchema,
    schema,
    fileName: firstString(fileName?.[0]),
    application: firstString(fileName?.[5]) ?? firstString(fileName?.[4]),
    ...(readAs ? { readAs } : {}),
  };
}
