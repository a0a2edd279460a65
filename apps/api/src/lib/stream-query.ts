import type { Readable } from 'node:stream';
import { sequelize } from './db.ts';

type StreamingConnection = { queryStream(sql: string, values?: unknown): Readable };

/**
 * Run a read-only query row by row through the MariaDB driver's stream, so an export of a million rows
 * never sits in memory. The connection goes back to the pool when the stream ends or fails.
 */
export async function streamRows(sql: string, values: unknown[]): Promise<Readable> {
  const cm = sequelize.connectionManager as unknown as { getConnection(o?: object): Promise<StreamingConnection>; releaseConnection(c: StreamingConnection): Promise<void> };
  const conn = await cm.getConnection({ type: 'SELECT' });
  const stream = conn.queryStream(sql, values);
  let released = false;
  const release = () => {
    if (released) return;
    released = true;
    void cm.releaseConnection(conn);
  };
  stream.once('end', release);
  stream.once('error', release);
  stream.once('close', release);
  return stream;
}
