/**
 * The stored form of a result set's governing forces: one binary file per result set, written once at import and
 * read whole by every check run. A million (member key, combination) entries of Vz alone are about 28 MB and load
 * in tens of milliseconds; the same values as SQLite rows took seconds to insert (measured, see the report of the
 * results import), so only the keys and counts go to the database.
 *
 * Layout, little-endian: 'TLGV' · version u32 · entry count u32 · JSON byte length u32 · JSON padded to 8 bytes ·
 * the columns one after the other, f64 columns first, then u32 ones.
 * - Version 2: JSON {memberKeys, combinations, sheets?, columns}; `columns` names the columns stored, in order
 *   (governing-shear.ts: the required ones and those the file gave values for).
 * - Version 1 (Vz only): JSON {memberKeys, combinations} · shear_N f64 · station_mm f64 · key u32 · combination u32 ·
 *   row u32. Still read.
 */
import { type GoverningColumn, type GoverningTable, isFloatColumn, REQUIRED_GOVERNING_COLUMNS, GOVERNING_FLOAT_COLUMNS, GOVERNING_INDEX_COLUMNS } from './governing-shear';

const MAGIC = 0x5647_4c54; // 'TLGV' read as a little-endian u32
const VERSION = 2;
const HEADER_BYTES = 16;
const VERSION_1_COLUMNS: readonly GoverningColumn[] = ['shear_N', 'station_mm', 'key', 'combination', 'row'];

interface FileHeader extends Pick<GoverningTable, 'memberKeys' | 'combinations' | 'sheets'> {
  columns?: GoverningColumn[];
}

/** The table as file bytes. */
export function encodeGoverningTable(table: GoverningTable): Buffer {
  const count = table.key.length;
  const columns = [...GOVERNING_FLOAT_COLUMNS, ...GOVERNING_INDEX_COLUMNS].filter((column) => table[column] !== undefined);
  const header: FileHeader = { memberKeys: table.memberKeys, combinations: table.combinations, ...(table.sheets && { sheets: table.sheets }), columns };
  const json = Buffer.from(JSON.stringify(header), 'utf8');
  const buffer = Buffer.alloc(HEADER_BYTES + align8(json.length) + columns.reduce((bytes, column) => bytes + count * bytesOf(column), 0));
  buffer.writeUInt32LE(MAGIC, 0);
  buffer.writeUInt32LE(VERSION, 4);
  buffer.writeUInt32LE(count, 8);
  buffer.writeUInt32LE(json.length, 12);
  json.copy(buffer, HEADER_BYTES);
  let offset = HEADER_BYTES + align8(json.length);
  for (const column of columns) {
    const values = table[column]!;
    Buffer.from(values.buffer, values.byteOffset, values.byteLength).copy(buffer, offset);
    offset += values.byteLength;
  }
  return buffer;
}

/** Reads a file written by encodeGoverningTable (either version); throws on anything else (a damaged or foreign file). */
export function decodeGoverningTable(file: Buffer): GoverningTable {
  if (file.length < HEADER_BYTES || file.readUInt32LE(0) !== MAGIC) throw new Error('not a governing-shear file');
  const version = file.readUInt32LE(4);
  if (version !== 1 && version !== VERSION) throw new Error(`governing-shear file version ${version} is not supported`);
  const count = file.readUInt32LE(8);
  const jsonLength = file.readUInt32LE(12);
  if (file.length < HEADER_BYTES + jsonLength) throw new Error('the governing-shear file is truncated');
  const header = JSON.parse(file.toString('utf8', HEADER_BYTES, HEADER_BYTES + jsonLength)) as FileHeader;
  const columns = version === 1 ? VERSION_1_COLUMNS : (header.columns ?? []);
  const known = new Set<string>([...GOVERNING_FLOAT_COLUMNS, ...GOVERNING_INDEX_COLUMNS]);
  if (columns.some((column) => !known.has(column)) || REQUIRED_GOVERNING_COLUMNS.some((column) => !columns.includes(column))) {
    throw new Error('the governing-shear file lists columns this version does not read');
  }
  const columnsAt = HEADER_BYTES + align8(jsonLength);
  if (file.length !== columnsAt + columns.reduce((bytes, column) => bytes + count * bytesOf(column), 0)) throw new Error('the governing-shear file is truncated');
  // Typed-array views need aligned offsets; a pooled or sliced buffer may not start on one, so copy then.
  const bytes = file.byteOffset % 8 === 0 ? file : copyUnpooled(file);
  const table: Record<string, unknown> = { memberKeys: header.memberKeys, combinations: header.combinations, ...(header.sheets && { sheets: header.sheets }) };
  let offset = columnsAt;
  for (const column of columns) {
    table[column] = isFloatColumn(column) ? new Float64Array(bytes.buffer, bytes.byteOffset + offset, count) : new Uint32Array(bytes.buffer, bytes.byteOffset + offset, count);
    offset += count * bytesOf(column);
  }
  return table as GoverningTable;
}

function bytesOf(column: GoverningColumn): number {
  return isFloatColumn(column) ? 8 : 4;
}

function copyUnpooled(file: Buffer): Buffer {
  // Buffer.alloc never hands out a slice of the shared pool, so the copy starts at offset 0.
  const copy = Buffer.alloc(file.length);
  file.copy(copy);
  return copy;
}

function align8(length: number): number {
  return Math.ceil(length / 8) * 8;
}
