// The API with one extra route, for `npm run bench:api` only: GET /api/bench/raw-board answers the
// board's first page from one raw SQL statement through the `mariadb` driver, behind exactly the same
// stack as GET /api/work-orders (helmet, gzip, session, passport, CSRF, the permission check, zod, JSON).
// The two routes of this one process, asked the same way, differ only in what runs between the query
// string and the response: the board's service (Sequelize, two queries) or the driver (one statement).
// Never part of the product: server.ts does not know this file.
import type { Express, Request, Response } from 'express';
import mariadb, { type Pool } from 'mariadb';
import { DUE_SOON_HOURS, openStatuses, pageQuerySchema, priorities as allPriorities, workOrderListQuerySchema } from '@stringfield/shared';
import { createApp } from '../../apps/api/src/app.ts';
import { env } from '../../apps/api/src/config/env.ts';
import { notFoundApi } from '../../apps/api/src/middleware/error-handler.ts';
import { requirePermission } from '../../apps/api/src/middleware/require-role.ts';

/** The board's statement for one filter shape (statuses, priorities, due date first), count included. */
export const rawBoardSql = `SELECT w.id, w.number, w.title, w.status, w.priority, w.fault_category, w.reported_at, w.due_at,
        w.submitted_at, w.signed_off_at, w.version, s.id AS site_id, s.code, s.name, s.time_zone,
        u.id AS assignee_id, u.name AS assignee,
        (SELECT COUNT(*) FROM work_orders w2 WHERE w2.status IN (?) AND w2.priority IN (?)) AS total,
        (SELECT GROUP_CONCAT(p.label ORDER BY p.label) FROM work_order_strings ws JOIN pv_strings p ON p.id = ws.string_id
          WHERE ws.work_order_id = w.id) AS labels
   FROM work_orders w JOIN sites s ON s.id = w.site_id LEFT JOIN users u ON u.id = w.assignee_id
  WHERE w.status IN (?) AND w.priority IN (?) ORDER BY w.due_at, w.id LIMIT ? OFFSET ?`;

type Row = {
  id: number;
  number: string;
  title: string;
  status: string;
  priority: string;
  fault_category: string;
  reported_at: Date;
  due_at: Date;
  submitted_at: Date | null;
  signed_off_at: Date | null;
  version: number;
  site_id: number;
  code: string;
  name: string;
  time_zone: string;
  assignee_id: number | null;
  assignee: string | null;
  total: number;
  labels: string | null;
};

/** The app of server.ts with the raw route placed where the API's routes are (before the API's 404). */
export function createRawBoardApp(pool: Pool): Express {
  const app = createApp({ webDist: null });
  app.get('/api/bench/raw-board', requirePermission('workOrders:read'), async (req: Request, res: Response) => {
    const q = workOrderListQuerySchema.and(pageQuerySchema).parse(req.query);
    const statuses = q.status ?? [...openStatuses];
    const priorities = q.priority ?? [...allPriorities];
    const rows = await pool.query<Row[]>(rawBoardSql, [
      statuses,
      priorities,
      statuses,
      priorities,
      q.pageSize,
      (q.page - 1) * q.pageSize,
    ]);
    const now = Date.now();
    res.json({
      items: rows.map((r) => {
        const labels = r.labels ? r.labels.split(',') : [];
        const due = r.due_at.getTime();
        const isOpen = (openStatuses as readonly string[]).includes(r.status);
        return {
          id: r.id,
          number: r.number,
          title: r.title,
          status: r.status,
          priority: r.priority,
          faultCategory: r.fault_category,
          site: { id: r.site_id, code: r.code, name: r.name, timeZone: r.time_zone },
          assignee: r.assignee_id === null ? null : { id: r.assignee_id, name: r.assignee ?? '' },
          reportedAt: r.reported_at.toISOString(),
          dueAt: r.due_at.toISOString(),
          isOverdue: isOpen && due < now,
          isDueSoon: isOpen && due >= now && due - now <= DUE_SOON_HOURS * 3_600_000,
          stringCount: labels.length,
          stringLabels: labels.slice(0, 3),
          submittedAt: r.submitted_at?.toISOString() ?? null,
          signedOffAt: r.signed_off_at?.toISOString() ?? null,
          isSlaMet: r.submitted_at ? r.submitted_at.getTime() <= due : null,
          version: r.version,
        };
      }),
      total: Number(rows[0]?.total ?? 0),
      page: q.page,
      pageSize: q.pageSize,
    });
  });
  // app.get() appended the route after the API's 404 handler; move it in front of it.
  const stack = (app as unknown as { router: { stack: Array<{ handle: unknown }> } }).router.stack;
  const route = stack.pop()!;
  const notFound = stack.findIndex((layer) => layer.handle === notFoundApi);
  if (notFound < 0) throw new Error('the API 404 handler was not found; has createApp changed?');
  stack.splice(notFound, 0, route);
  return app;
}

if (process.argv[1]?.endsWith('raw-board-server.ts')) {
  // The driver's pool the same size as Sequelize's, so neither route has more connections.
  const pool = mariadb.createPool({
    host: env.DB_HOST,
    port: env.DB_PORT,
    user: env.DB_USER,
    password: env.DB_PASSWORD,
    database: env.DB_NAME,
    connectionLimit: env.DB_POOL_MAX,
    bigIntAsNumber: true,
    decimalAsNumber: true,
    timezone: '+00:00',
  });
  const server = createRawBoardApp(pool).listen(env.PORT, '127.0.0.1');
  process.on('SIGTERM', () => {
    server.close();
    server.closeAllConnections();
    void pool.end().finally(() => process.exit(0));
  });
}
