import type { Readable } from 'node:stream';
import { sequelize } from './db.ts';

type StreamingConnection = {
  queryStream(sql: string, values?: unknown): Readable;
  ping(): Promise<void>;
  readonly threadId: number | null;
};
type QueryStream = Readable & { close(): void };

/**
 * Run a read-only query row by row through the MariaDB driver's stream, so an export of a million rows
 * never sits in memory. The connection goes back to the pool when the driver has finished the query.
 * When the reader goes away first (a download cancelled half-way), the query is killed on the server and
 * the driver told to skip what is still in flight; a paused stream would otherwise hold its pooled
 * connection for good. (Written against connector 3.0.2, whose own `destroy()` could not do this: its kill
 * path threw. tests/api/fleet.test.ts, "gives the database connection back when a download is cancelled
 * half-way", holds it on the connector in use.)
 */
export async function streamRows(sql: string, values: unknown[]): Promise<Readable> {
  const cm = sequelize.connectionManager as unknown as {
    getConnection(o?: object): Promise<StreamingConnection>;
    releaseConnection(c: StreamingConnection): Promise<void>;
  };
  const conn = await cm.getConnection({ type: 'SELECT' });
  const stream = conn.queryStream(sql, values) as QueryStream;
  let settled = false; // the driver is done with the query: all rows read, or its own error
  let released = false;
  const release = () => {
    if (released) return;
    released = true;
    void cm.releaseConnection(conn);
  };
  stream.once('end', () => {
    settled = true;
    release();
  });
  // Kept for good: the driver may still report the killed query after the stream was destroyed.
  stream.on('error', () => {
    if (stream.destroyed) return; // torn down by the reader; handled on 'close'
    settled = true;
    release();
  });
  stream.once('close', () => {
    if (settled) return release();
    stream.close();
    const threadId = Number(conn.threadId);
    const kill = threadId
      ? sequelize.query(`KILL QUERY ${threadId}`).catch(() => undefined)
      : Promise.resolve();
    // The ping is answered only after the cancelled query, so the connection is free (and the kill
    // spent) before anyone else gets it.
    void Promise.allSettled([kill, conn.ping()]).then(release);
  });
  return stream;
}
