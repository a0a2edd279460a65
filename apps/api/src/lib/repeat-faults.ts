/** Days after a sign-off within which a new ticket on the same string counts as a repeat fault. */
export const REPEAT_WINDOW_DAYS = 90;

/**
 * Marks each ticket string whose string had a ticket signed off in the 90 days before the new ticket was
 * reported (the latest such sign-off). Used by the migration, the seeders and bulk loads; the API sets it
 * for each new ticket as it is created.
 */
export const REPEAT_BACKFILL_SQL = `
UPDATE work_order_strings ws
  JOIN work_orders w ON w.id = ws.work_order_id
   SET ws.repeat_of_id = (
     SELECT wp.id FROM work_order_strings wsp JOIN work_orders wp ON wp.id = wsp.work_order_id
      WHERE wsp.string_id = ws.string_id AND wsp.work_order_id <> ws.work_order_id AND wp.status = 'signed_off'
        AND wp.signed_off_at < w.reported_at AND wp.signed_off_at >= DATE_SUB(w.reported_at, INTERVAL ${REPEAT_WINDOW_DAYS} DAY)
      ORDER BY wp.signed_off_at DESC LIMIT 1)
 WHERE ws.repeat_of_id IS NULL`;
