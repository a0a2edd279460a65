import { Transform, pipeline, type Readable } from 'node:stream';
import { stringify } from 'csv-stringify';
import type { SessionUser } from '@stringfield/shared';
import { streamRows } from '../lib/stream-query.ts';
import { findVisibleSite } from './site-access.ts';

type Export = { columns: string[]; sql: string; row: (r: Record<string, unknown>) => unknown[] };

const iso = (d: unknown) => (d instanceof Date ? d.toISOString() : typeof d === 'string' ? d : '');
const findingCodes = (json: unknown) => {
  try {
    return (JSON.parse(String(json)) as Array<{ code: string }>).map((f) => f.code).join(' ');
  } catch {
    return '';
  }
};

const exportsByName: Record<'tickets' | 'checks' | 'diode-replacements', Export> = {
  tickets: {
    columns: [
      'number',
      'site',
      'status',
      'priority',
      'fault_category',
      'title',
      'reported_at',
      'due_at',
      'dispatched_at',
      'submitted_at',
      'signed_off_at',
      'returns',
      'assignee',
      'strings',
    ],
    sql: `SELECT w.number, st.code, w.status, w.priority, w.fault_category, w.title, w.reported_at, w.due_at, w.dispatched_at, w.submitted_at, w.signed_off_at, w.return_count, u.name AS assignee,
                 (SELECT GROUP_CONCAT(s.label ORDER BY s.label SEPARATOR ' ') FROM work_order_strings ws JOIN pv_strings s ON s.id = ws.string_id WHERE ws.work_order_id = w.id) AS strings
            FROM work_orders w JOIN sites st ON st.id = w.site_id LEFT JOIN users u ON u.id = w.assignee_id
           WHERE w.site_id = ? AND w.reported_at >= ? AND w.reported_at < ? ORDER BY w.reported_at, w.id`,
    row: (r) => [
      r.number,
      r.code,
      r.status,
      r.priority,
      r.fault_category,
      r.title,
      iso(r.reported_at),
      iso(r.due_at),
      iso(r.dispatched_at),
      iso(r.submitted_at),
      iso(r.signed_off_at),
      r.return_count,
      r.assignee ?? '',
      r.strings ?? '',
    ],
  },
  checks: {
    columns: [
      'ticket',
      'string',
      'phase',
      'taken_at',
      'technician',
      'voc_v',
      'isc_a',
      'irradiance_wm2',
      'module_temp_c',
      'expected_voc_v',
      'expected_isc_a',
      'voc_deviation_pct',
      'isc_deviation_pct',
      'verdict',
      'findings',
      'insulation_plus_mohm',
      'insulation_minus_mohm',
      'engine_version',
      'superseded',
    ],
    sql: `SELECT w.number, s.label, c.phase, c.taken_at, u.name AS technician, c.voc_v, c.isc_a, c.irradiance_wm2, c.module_temp_c,
                 JSON_VALUE(c.expected_json, '$.vocV') AS exp_voc, JSON_VALUE(c.expected_json, '$.iscA') AS exp_isc,
                 c.voc_deviation_pct, c.isc_deviation_pct, c.verdict, c.findings_json, c.insulation_plus_mohm, c.insulation_minus_mohm, c.engine_version, c.superseded_by_id
            FROM string_checks c JOIN work_orders w ON w.id = c.work_order_id JOIN pv_strings s ON s.id = c.string_id JOIN users u ON u.id = c.technician_id
           WHERE w.site_id = ? AND c.taken_at >= ? AND c.taken_at < ? ORDER BY c.taken_at, c.id`,
    row: (r) => [
      r.number,
      r.label,
      r.phase,
      iso(r.taken_at),
      r.technician,
      r.voc_v,
      r.isc_a ?? '',
      r.irradiance_wm2 ?? '',
      r.module_temp_c ?? '',
      r.exp_voc ?? '',
      r.exp_isc ?? '',
      r.voc_deviation_pct ?? '',
      r.isc_deviation_pct ?? '',
      r.verdict,
      findingCodes(r.findings_json),
      r.insulation_plus_mohm ?? '',
      r.insulation_minus_mohm ?? '',
      r.engine_version,
      r.superseded_by_id ? 'yes' : 'no',
    ],
  },
  'diode-replacements': {
    columns: [
      'ticket',
      'string',
      'module_position',
      'module_serial',
      'diode_position',
      'failure',
      'found_by',
      'installed_part',
      'forward_v',
      'voc_before_v',
      'voc_after_v',
      'technician',
      'recorded_at',
    ],
    sql: `SELECT w.number, s.label, d.module_position, d.module_serial, d.diode_position, d.failure_mode, d.found_by,
                 JSON_VALUE(d.installed_part_json, '$.partNumber') AS part, d.new_diode_forward_v, d.voc_before_v, d.voc_after_v, u.name AS technician, d.created_at
            FROM diode_replacements d JOIN work_orders w ON w.id = d.work_order_id JOIN pv_strings s ON s.id = d.string_id JOIN users u ON u.id = d.technician_id
           WHERE w.site_id = ? AND d.created_at >= ? AND d.created_at < ? ORDER BY d.created_at, d.id`,
    row: (r) => [
      r.number,
      r.label,
      r.module_position,
      r.module_serial,
      r.diode_position,
      r.failure_mode,
      r.found_by,
      r.part ?? '',
      r.new_diode_forward_v ?? '',
      r.voc_before_v ?? '',
      r.voc_after_v ?? '',
      r.technician,
      iso(r.created_at),
    ],
  },
};

export type ExportName = keyof typeof exportsByName;

/** A CSV export as a stream: rows flow from the database through csv-stringify to the response. */
export async function exportCsv(
  user: SessionUser,
  name: ExportName,
  q: { siteId: number; from: string; to: string },
): Promise<{ stream: Readable; fileName: string }> {
  const site = await findVisibleSite(user, q.siteId);
  const e = exportsByName[name];
  const from = new Date(`${q.from}T00:00:00Z`);
  const to = new Date(new Date(`${q.to}T00:00:00Z`).getTime() + 86_400_000);
  // Owners see signed-off work only.
  const sql =
    user.role === 'owner'
      ? e.sql.replace('WHERE w.site_id = ?', "WHERE w.status = 'signed_off' AND w.site_id = ?")
      : e.sql;
  const rows = await streamRows(sql, [site.id, from, to]);
  const toRecord = new Transform({
    objectMode: true,
    transform(row: Record<string, unknown>, _enc, cb) {
      cb(null, e.row(row));
    },
  });
  // Free text (ticket titles, names, serials) must not run as a spreadsheet formula when the file is
  // opened: csv-stringify prefixes text starting with = + - @ tab or CR with a quote; numbers stay numbers.
  const csv = stringify({ header: true, columns: e.columns, bom: true, escape_formulas: true });
  // One pipeline, so that a failure or a cancelled download anywhere tears down every stage, the
  // database stream included (see streamRows). Errors reach the caller through the last stage.
  const stream = pipeline(rows, toRecord, csv, () => {});
  return { stream, fileName: `stringfield-${site.code}-${name}-${q.from}-to-${q.to}.csv` };
}
