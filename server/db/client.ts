import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import pg from 'pg';
import * as schema from './schema/index';

export type Db = NodePgDatabase<typeof schema>;
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
export type DbOrTx = Db | Tx;

type Options = {
  max?: number;
  /** Told of a connection lost under a client (the server restarting); the query in flight fails on its own. */
  onConnectionError?: (err: Error) => void;
};

export function createDb(databaseUrl: string, options: Options = {}) {
  const pool = new pg.Pool({ connectionString: databaseUrl, max: options.max ?? 10, connectionTimeoutMillis: 3000 });
  survivesLostConnections(pool, options.onConnectionError ?? (() => {}));
  const db = drizzle(pool, { schema, casing: 'snake_case' });
  return { db, pool };
}

/**
 * A pg client emits 'error' when its connection drops (PostgreSQL restarting: 57P01), and an 'error' nobody listens
 * to ends the process. The pool listens only while a client is idle, so a client checked out (a Drizzle transaction)
 * had no listener. Here every client keeps one for its whole life.
 *
 * A checked-out client that loses its connection is also handed back to the pool at once, which drops it: Drizzle
 * never releases a client whose BEGIN fails, and each such client would otherwise stay checked out for good until
 * the pool had none left. Its owner's own release later does nothing; its queries fail as "not queryable".
 */
function survivesLostConnections(pool: pg.Pool, onError: (err: Error) => void) {
  const checkedOut = new Set<pg.PoolClient>();
  pool.on('acquire', (client) => checkedOut.add(client));
  pool.on('release', (_err, client) => checkedOut.delete(client));
  pool.on('remove', (client) => checkedOut.delete(client as pg.PoolClient));
  pool.on('connect', (client) => {
    client.on('error', (err) => {
      onError(err);
      const owned = client as pg.PoolClient;
      if (!checkedOut.delete(owned)) return;
      const release = owned.release.bind(owned);
      owned.release = () => {};
      release(err);
    });
  });
  // An idle client erroring: the pool has already dropped it; the next query reports any outage.
  pool.on('error', onError);
}
