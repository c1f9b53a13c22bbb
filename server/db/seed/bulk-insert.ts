import type { PgTable, PgInsertValue } from 'drizzle-orm/pg-core';
import type { Tx } from '../client';

/** Multi-row inserts in chunks that stay well under PostgreSQL's 65,535 parameters per statement. */
export async function bulkInsert<T extends PgTable>(tx: Tx, table: T, rows: PgInsertValue<T>[], chunkSize = 400) {
  for (let i = 0; i < rows.length; i += chunkSize) await tx.insert(table).values(rows.slice(i, i + chunkSize));
}
