/**
 * The ingest worker hands its members to the server as a file of one MemberRecord JSON per line: the server then
 * reads them in small batches, so neither a huge message between threads nor a long write transaction is needed.
 */
import { closeSync, createReadStream, openSync, writeSync } from 'node:fs';
import { createInterface } from 'node:readline';
import type { MemberRecord } from '../ifc/model-read-result';

const LINES_PER_WRITE = 500;

export function writeMemberLines(file: string, records: readonly MemberRecord[]): void {
  const fd = openSync(file, 'w');
  try {
    for (let start = 0; start < records.length; start += LINES_PER_WRITE) {
      const chunk = records.slice(start, start + LINES_PER_WRITE).map((record) => `${JSON.stringify(record)}\n`);
      writeSync(fd, chunk.join(''));
    }
  } finally {
    closeSync(fd);
  }
}

/** The records' JSON texts, `size` at a time. */
export async function* memberLineBatches(file: string, size: number): AsyncGenerator<string[]> {
  let batch: string[] = [];
  for await (const line of createInterface({ input: createReadStream(file, 'utf8'), crlfDelay: Infinity })) {
    if (line === '') continue;
    batch.push(line);
    if (batch.length === size) {
      yield batch;
      batch = [];
    }
  }
  if (batch.length > 0) yield batch;
}
