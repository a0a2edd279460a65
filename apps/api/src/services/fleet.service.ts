import { QueryTypes } from 'sequelize';
import { expectedString } from '@stringfield/pv';
import {
  openStatuses,
  type EnergyAtRiskItem,
  type FaultCategory,
  type HealthMap,
  type Metrics,
  type MetricsQuery,
  type SessionUser,
  type WorkOrderStatus,
} from '@stringfield/shared';
import { ModuleModel, sequelize } from '../models/index.ts';
import { findVisibleSite, visibleSiteIds } from './site-access.ts';

const open = [...openStatuses];

/** Every string of a site with its latest current check and whether an open ticket covers it: one query. */
export async function healthMap(user: SessionUser, siteId: number): Promise<HealthMap> {
  await findVisibleSite(user, siteId);
  const rows = await sequelize.query<{
    id: number;
    label: string;
    inverter_tag: string;
    mppt_input: number;
    combiner_tag: string | null;
    combiner_position: number | null;
    verdict: 'pass' | 'attention' | 'fail' | null;
    voc_deviation_pct: number | null;
    isc_deviation_pct: number | null;
    taken_at: Date | null;
    open_tickets: number;
  }>(
    `SELECT s.id, s.label, i.tag AS inverter_tag, s.mppt_input, cb.tag AS combiner_tag, s.combiner_position,
            c.verdict, c.voc_deviation_pct, c.isc_deviation_pct, c.taken_at, COALESCE(o.n, 0) AS open_tickets
       FROM pv_strings s
       JOIN inverters i ON i.id = s.inverter_id
       LEFT JOIN combiner_boxes cb ON cb.id = s.combiner_box_id
       LEFT JOIN (
         SELECT string_id, verdict, voc_deviation_pct, isc_deviation_pct, taken_at,
                ROW_NUMBER() OVER (PARTITION BY string_id ORDER BY taken_at DESC, id DESC) AS rn
           FROM string_checks WHERE superseded_by_id IS NULL
            AND string_id IN (SELECT id FROM pv_strings WHERE site_id = :siteId)
       ) c ON c.string_id = s.id AND c.rn = 1
       LEFT JOIN (
         SELECT ws.string_id, COUNT(*) AS n FROM work_order_strings ws JOIN work_orders w ON w.id = ws.work_order_id
          WHERE w.site_id = :siteId AND w.status IN (:open) GROUP BY ws.string_id
       ) o ON o.string_id = s.id
      WHERE s.site_id = :siteId AND s.is_archived = 0
      ORDER BY i.tag, s.mppt_input, s.label`,
    { replacements: { siteId, open }, type: QueryTypes.SELECT },
  );
  const cells = rows.map((r) => ({
    stringId: r.id,
    label: r.label,
    inverterTag: r.inverter_tag,
    mpptInput: r.mppt_input,
    combinerTag: r.combiner_tag,
    combinerPosition: r.combiner_position,
    verdict: r.verdict,
    vocDeviationPct: r.voc_deviation_pct,
    iscDeviationPct: r.isc_deviation_pct,
    checkedAt: r.taken_at ? new Date(r.taken_at).toISOString() : null,
    openTickets: Number(r.open_tickets),
  }));
  const count = (v: string | null) => cells.filter((c) => c.verdict === v).length;
  return {
    siteId,
    cells,
    counts: {
      pass: count('pass'),
      attention: count('attention'),
      fail: count('fail'),
      unchecked: count(null),
      withOpenTickets: cells.filter((c) => c.openTickets > 0).length,
    },
  };
}

/**
 * For each open ticket, the power its strings are missing now: expected Pmp at the site's design
 * irradiance and 25 °C minus what the latest check implies (Pmp scaled by the measured Voc and Isc
 * ratios), and a rough daily kWh from the site's assumed peak sun hours. An estimate, labelled so.
 */
export async function energyAtRisk(user: SessionUser, siteId?: number): Promise<EnergyAtRiskItem[]> {
  const visible = await visibleSiteIds(user);
  const rows = await sequelize.query<{
    work_order_id: number;
    number: string;
    site_code: string;
    design_irradiance_wm2: number;
    peak_sun_hours: number;
    module_model_id: number;
    modules_in_series: number;
    voc_deviation_pct: number | null;
    isc_deviation_pct: number | null;
    voc_v: number | null;
  }>(
    `SELECT w.id AS work_order_id, w.number, st.code AS site_code, st.design_irradiance_wm2, st.peak_sun_hours,
            s.module_model_id, s.modules_in_series, c.voc_deviation_pct, c.isc_deviation_pct, c.voc_v
       FROM work_orders w
       JOIN sites st ON st.id = w.site_id
       JOIN work_order_strings ws ON ws.work_order_id = w.id
       JOIN pv_strings s ON s.id = ws.string_id
       LEFT JOIN (
         SELECT string_id, voc_deviation_pct, isc_deviation_pct, voc_v,
                ROW_NUMBER() OVER (PARTITION BY string_id ORDER BY taken_at DESC, id DESC) AS rn
           FROM string_checks WHERE superseded_by_id IS NULL
            AND string_id IN (SELECT ws2.string_id FROM work_order_strings ws2 JOIN work_orders w2 ON w2.id = ws2.work_order_id WHERE w2.status IN (:open))
       ) c ON c.string_id = s.id AND c.rn = 1
      WHERE w.status IN (:open) ${siteId ? 'AND w.site_id = :siteId' : ''} ${visible ? 'AND w.site_id IN (:visible)' : ''}`,
    { replacements: { open, siteId, visible: visible?.length ? visible : [-1] }, type: QueryTypes.SELECT },
  );
  const modules = new Map(
    (await ModuleModel.findAll({ where: { id: [...new Set(rows.map((r) => r.module_model_id))] } })).map(
      (m) => [m.id, m],
    ),
  );
  const pmpMemo = new Map<string, number>();
  const byTicket = new Map<number, EnergyAtRiskItem>();
  for (const r of rows) {
    const key = `${r.module_model_id}|${r.modules_in_series}|${r.design_irradiance_wm2}`;
    let pmp = pmpMemo.get(key);
    if (pmp === undefined) {
      pmp = expectedString({
        module: modules.get(r.module_model_id)!.toSpec(),
        modulesInSeries: r.modules_in_series,
        irradianceWm2: r.design_irradiance_wm2,
        moduleTempC: 25,
      }).pmpW;
      pmpMemo.set(key, pmp);
    }
    let ratio = 1;
    let basis = 'no check yet: the whole string is counted';
    if (r.voc_v !== null) {
      const v = 1 + (r.voc_deviation_pct ?? 0) / 100;
      const i = 1 + (r.isc_deviation_pct ?? 0) / 100;
      ratio = 1 - Math.max(0, Math.min(1, Math.max(0, v) * Math.max(0, i)));
      basis = 'latest check: Pmp scaled by the measured Voc and Isc ratios';
    }
    const item = byTicket.get(r.work_order_id) ?? {
      workOrderId: r.work_order_id,
      number: r.number,
      siteCode: r.site_code,
      missingW: 0,
      dailyKWh: 0,
      peakSunHours: r.peak_sun_hours,
      basis,
    };
    item.missingW += pmp * ratio;
    item.dailyKWh = (item.missingW / 1000) * r.peak_sun_hours;
    byTicket.set(r.work_order_id, item);
  }
  return [...byTicket.values()]
    .map((x) => ({ ...x, missingW: Math.round(x.missingW), dailyKWh: Math.round(x.dailyKWh * 10) / 10 }))
    .sort((a, b) => b.missingW - a.missingW);
}

/** Work-order metrics as SQL aggregates over tickets reported in the period (open counts: now). */
export async function metrics(user: SessionUser, q: MetricsQuery): Promise<Metrics> {
  const visible = await visibleSiteIds(user);
  if (q.siteId) await findVisibleSite(user, q.siteId);
  const from = new Date(`${q.from}T00:00:00Z`);
  const to = new Date(new Date(`${q.to}T00:00:00Z`).getTime() + 86_400_000);
  const conditions = [
    ...(q.siteId ? ['w.site_id = :siteId'] : []),
    ...(visible ? ['w.site_id IN (:visible)'] : []),
    ...(q.faultCategory ? ['w.fault_category = :faultCategory'] : []),
    // Owners only ever see signed-off tickets.
    ...(user.role === 'owner' ? ["w.status = 'signed_off'"] : []),
  ];
  const scope = conditions.length ? `AND ${conditions.join(' AND ')}` : '';
  const r = {
    siteId: q.siteId,
    visible: visible?.length ? visible : [-1],
    faultCategory: q.faultCategory,
    from,
    to,
    open,
    now: new Date(),
  };
  const select = <T extends object>(sql: string) =>
    sequelize.query<T>(sql, { replacements: r, type: QueryTypes.SELECT });

  const [openRows, overdue, meanRows, ftf, repeats, top] = await Promise.all([
    select<{ status: WorkOrderStatus; n: number; age_h: number }>(
      `SELECT w.status, COUNT(*) AS n, AVG(TIMESTAMPDIFF(MINUTE, w.reported_at, :now)) / 60 AS age_h
         FROM work_orders w WHERE w.status IN (:open) ${scope} GROUP BY w.status`,
    ),
    select<{ n: number }>(
      `SELECT COUNT(*) AS n FROM work_orders w WHERE w.status IN (:open) AND w.due_at < :now ${scope}`,
    ),
    select<{
      site_id: number;
      code: string;
      fault_category: FaultCategory;
      n: number;
      dispatch_h: number | null;
      repair_h: number | null;
      signoff_h: number | null;
    }>(
      // Aggregated before the join: joined first, MariaDB walks every ticket of each site by its
      // site index (360 ms at 100,000 tickets) instead of the period's range of the covering index (35 ms).
      `SELECT a.*, st.code FROM (
         SELECT w.site_id, w.fault_category, COUNT(*) AS n,
                AVG(TIMESTAMPDIFF(MINUTE, w.reported_at, w.dispatched_at)) / 60 AS dispatch_h,
                AVG(TIMESTAMPDIFF(MINUTE, w.reported_at, w.submitted_at)) / 60 AS repair_h,
                AVG(TIMESTAMPDIFF(MINUTE, w.reported_at, w.signed_off_at)) / 60 AS signoff_h
           FROM work_orders w
          WHERE w.reported_at >= :from AND w.reported_at < :to ${scope}
          GROUP BY w.site_id, w.fault_category) a
         JOIN sites st ON st.id = a.site_id
        ORDER BY st.code, a.fault_category`,
    ),
    select<{ signed: number; clean: number }>(
      `SELECT COUNT(*) AS signed, COALESCE(SUM(w.return_count = 0), 0) AS clean
         FROM work_orders w WHERE w.status = 'signed_off' AND w.signed_off_at >= :from AND w.signed_off_at < :to ${scope}`,
    ),
    // A repeat: a ticket reported in the period on a string with a sign-off in the 90 days before
    // (marked on the ticket's string when the ticket is created).
    select<{ string_id: number; label: string; code: string; repeats: number }>(
      `SELECT s.id AS string_id, s.label, st.code, COUNT(*) AS repeats
         FROM work_order_strings ws
         JOIN work_orders w ON w.id = ws.work_order_id
         JOIN pv_strings s ON s.id = ws.string_id
         JOIN sites st ON st.id = s.site_id
        WHERE ws.repeat_of_id IS NOT NULL AND w.reported_at >= :from AND w.reported_at < :to ${scope}
        GROUP BY s.id, s.label, st.code ORDER BY repeats DESC, s.label LIMIT 50`,
    ),
    select<{ fault_category: FaultCategory; n: number }>(
      `SELECT w.fault_category, COUNT(*) AS n FROM work_orders w
        WHERE w.reported_at >= :from AND w.reported_at < :to ${scope}
        GROUP BY w.fault_category ORDER BY n DESC, w.fault_category LIMIT 12`,
    ),
  ]);
  const num = (x: number | string | null) => (x === null ? null : Math.round(Number(x) * 10) / 10);
  const signed = Number(ftf[0]?.signed ?? 0);
  const clean = Number(ftf[0]?.clean ?? 0);
  return {
    period: { from: q.from, to: q.to },
    openByStatus: openRows.map((o) => ({
      status: o.status,
      count: Number(o.n),
      averageAgeHours: num(o.age_h) ?? 0,
    })),
    overdueCount: Number(overdue[0]?.n ?? 0),
    meanTimes: meanRows.map((m) => ({
      siteId: m.site_id,
      siteCode: m.code,
      faultCategory: m.fault_category,
      tickets: Number(m.n),
      toDispatchHours: num(m.dispatch_h),
      toRepairHours: num(m.repair_h),
      toSignOffHours: num(m.signoff_h),
    })),
    firstTimeFix: {
      signedOff: signed,
      withoutReturn: clean,
      rate: signed ? Math.round((clean / signed) * 1000) / 1000 : null,
    },
    repeatFaults: repeats.map((x) => ({
      stringId: x.string_id,
      label: x.label,
      siteCode: x.code,
      repeats: Number(x.repeats),
    })),
    topFaultCategories: top.map((t) => ({ faultCategory: t.fault_category, count: Number(t.n) })),
  };
}
