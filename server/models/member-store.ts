/**
 * Writes a revision's members (model_member rows and their whole records) in short transactions of a few hundred
 * rows, so the shared database connection is never held long and other requests keep being answered. The revision
 * is still 'ingesting' meanwhile, and members of a revision that is not ready are never read, so a write cut short
 * leaves nothing visible; the caller removes the rows when the ingest fails.
 */
import type { DataSource } from 'typeorm';
import { runTransaction } from '../data-source';
import type { MemberRecord } from '../ifc/model-read-result';
import { memberLineBatches } from './member-lines';
import { MEMBER_ROW_COLUMNS, memberRowOf } from './member-row';

/** 500 rows × 22 values stays below SQLite's 32,766 bound parameters per statement. */
const ROWS_PER_BATCH = 500;

function insertSql(table: string, columns: readonly string[], rows: number): string {
  const tuple = `(${columns.map(() => '?').join(',')})`;
  return `INSERT INTO "${table}" (${columns.map((c) => `"${c}"`).join(',')}) VALUES ${Array(rows).fill(tuple).join(',')}`;
}

const MEMBER_COLUMNS = ['revisionId', ...MEMBER_ROW_COLUMNS];
const RECORD_COLUMNS = ['revisionId', 'expressId', 'record'];

function memberValues(revisionId: string, record: MemberRecord): unknown[] {
  const row = memberRowOf(record);
  return [
    revisionId,
    ...MEMBER_ROW_COLUMNS.map((column) => {
      const value = row[column];
      if (column === 'flags') return JSON.stringify(value);
      return typeof value === 'boolean' ? Number(value) : value;
    }),
  ];
}

/** Stores the members listed in `file` (member-lines.ts); `onProgress` gets the fraction of `total` written. */
export async function storeMembers(
  dataSource: DataSource,
  revisionId: string,
  file: string,
  total: number,
  onProgress: (fraction: number) => void,
): Promise<void> {
  let stored = 0;
  for await (const lines of memberLineBatches(file, ROWS_PER_BATCH)) {
    const records = lines.map((line) => JSON.parse(line) as MemberRecord);
    await runTransaction(dataSource, async (manager) => {
      await manager.query(insertSql('model_member', MEMBER_COLUMNS, records.length), records.flatMap((r) => memberValues(revisionId, r)));
      await manager.query(
        insertSql('model_member_record', RECORD_COLUMNS, records.length),
        records.flatMap((record, i) => [revisionId, record.expressId, lines[i]]),
      );
    });
    stored += records.length;
    onProgress(total > 0 ? stored / total : 1);
  }
}
