/**
 * Unpacks a WOFF 1.0 font into the plain TrueType/OpenType (sfnt) file it wraps, using Node's zlib. fontkit can read
 * WOFF itself but inflates every table in JavaScript for every new document, which was most of a report's build time;
 * unpacking once per process with native zlib removes that. Layout per the W3C WOFF File Format 1.0 recommendation
 * (§3 header, §4 table directory, §5 font data) and the OpenType table directory (offset table + 16-byte records).
 */
import { inflateSync } from 'node:zlib';

const WOFF_SIGNATURE = 0x774f4646; // 'wOFF'
const WOFF_HEADER_BYTES = 44;
const WOFF_ENTRY_BYTES = 20;
const SFNT_HEADER_BYTES = 12;
const SFNT_RECORD_BYTES = 16;

interface WoffTable {
  tag: number;
  offset: number;
  compLength: number;
  origLength: number;
  checksum: number;
}

const padded = (length: number): number => (length + 3) & ~3;

export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.length < WOFF_HEADER_BYTES || woff.readUInt32BE(0) !== WOFF_SIGNATURE) throw new Error('not a WOFF 1.0 font');
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables: WoffTable[] = [];
  for (let i = 0; i < numTables; i++) {
    const at = WOFF_HEADER_BYTES + i * WOFF_ENTRY_BYTES;
    tables.push({
      tag: woff.readUInt32BE(at),
      offset: woff.readUInt32BE(at + 4),
      compLength: woff.readUInt32BE(at + 8),
      origLength: woff.readUInt32BE(at + 12),
      checksum: woff.readUInt32BE(at + 16),
    });
  }
  const directoryBytes = SFNT_HEADER_BYTES + numTables * SFNT_RECORD_BYTES;
  const total = tables.reduce((sum, table) => sum + padded(table.origLength), directoryBytes);
  const sfnt = Buffer.alloc(total);
  const entrySelector = Math.floor(Math.log2(numTables));
  const searchRange = 2 ** entrySelector * 16;
  sfnt.writeUInt32BE(flavor, 0);
  sfnt.writeUInt16BE(numTables, 4);
  sfnt.writeUInt16BE(searchRange, 6);
  sfnt.writeUInt16BE(entrySelector, 8);
  sfnt.writeUInt16BE(numTables * 16 - searchRange, 10);
  let dataOffset = directoryBytes;
  tables.forEach((table, i) => {
    const stored = woff.subarray(table.offset, table.offset + table.compLength);
    // §5: a table is stored uncompressed when compressing would not make it smaller.
    const data = table.compLength < table.origLength ? inflateSync(stored) : stored;
    if (data.length !== table.origLength) throw new Error('WOFF table does not unpack to its declared length');
    const record = SFNT_HEADER_BYTES + i * SFNT_RECORD_BYTES;
    sfnt.writeUInt32BE(table.tag, record);
    sfnt.writeUInt32BE(table.checksum, record + 4);
    sfnt.writeUInt32BE(dataOffset, record + 8);
    sfnt.writeUInt32BE(table.origLength, record + 12);
    data.copy(sfnt, dataOffset);
    dataOffset += padded(table.origLength);
  });
  return sfnt;
}
