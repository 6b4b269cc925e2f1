/**
 * The stored form of a result set's governing shears: one binary file per result set, written once at import and
 * read whole by every check run. A million (member key, combination) values are about 28 MB and load in tens of
 * milliseconds; the same values as SQLite rows took seconds to insert (measured, see the report of the results
 * import), so only the keys and counts go to the database.
 *
 * Layout, little-endian: 'TLGV' · version u32 · entry count u32 · JSON byte length u32 · JSON {memberKeys,
 * combinations} padded to 8 bytes · shear_N f64[n] · station_mm f64[n] · key u32[n] · combination u32[n] · row u32[n].
 */
import type { GoverningTable } from './governing-shear';

const MAGIC = 0x5647_4c54; // 'TLGV' read as a little-endian u32
const VERSION = 1;
const HEADER_BYTES = 16;

/** The table as file bytes. */
export function encodeGoverningTable(table: GoverningTable): Buffer {
  const count = table.key.length;
  const json = Buffer.from(JSON.stringify({ memberKeys: table.memberKeys, combinations: table.combinations }), 'utf8');
  const jsonPadded = align8(json.length);
  const buffer = Buffer.alloc(HEADER_BYTES + jsonPadded + count * (8 + 8 + 4 + 4 + 4));
  buffer.writeUInt32LE(MAGIC, 0);
  buffer.writeUInt32LE(VERSION, 4);
  buffer.writeUInt32LE(count, 8);
  buffer.writeUInt32LE(json.length, 12);
  json.copy(buffer, HEADER_BYTES);
  let offset = HEADER_BYTES + jsonPadded;
  for (const column of [table.shear_N, table.station_mm, table.key, table.combination, table.row]) {
    const bytes = Buffer.from(column.buffer, column.byteOffset, column.byteLength);
    bytes.copy(buffer, offset);
    offset += bytes.length;
  }
  return buffer;
}

/** Reads a file written by encodeGoverningTable; throws on anything else (a damaged or foreign file). */
export function decodeGoverningTable(file: Buffer): GoverningTable {
  if (file.length < HEADER_BYTES || file.readUInt32LE(0) !== MAGIC) throw new Error('not a governing-shear file');
  if (file.readUInt32LE(4) !== VERSION) throw new Error(`governing-shear file version ${file.readUInt32LE(4)} is not supported`);
  const count = file.readUInt32LE(8);
  const jsonLength = file.readUInt32LE(12);
  const columnsAt = HEADER_BYTES + align8(jsonLength);
  if (file.length !== columnsAt + count * 28) throw new Error('the governing-shear file is truncated');
  const { memberKeys, combinations } = JSON.parse(file.toString('utf8', HEADER_BYTES, HEADER_BYTES + jsonLength)) as Pick<GoverningTable, 'memberKeys' | 'combinations'>;
  // Typed-array views need aligned offsets; a pooled or sliced buffer may not start on one, so copy then.
  const bytes = file.byteOffset % 8 === 0 ? file : copyUnpooled(file);
  const view = <T>(Type: { new (buffer: ArrayBufferLike, offset: number, length: number): T }, at: number): T =>
    new Type(bytes.buffer, bytes.byteOffset + at, count);
  return {
    memberKeys,
    combinations,
    shear_N: view(Float64Array, columnsAt),
    station_mm: view(Float64Array, columnsAt + 8 * count),
    key: view(Uint32Array, columnsAt + 16 * count),
    combination: view(Uint32Array, columnsAt + 20 * count),
    row: view(Uint32Array, columnsAt + 24 * count),
  };
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
