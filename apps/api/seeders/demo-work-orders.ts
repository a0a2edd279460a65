import { addHours, addMinutes, subDays, subHours } from 'date-fns';
import type { Transaction } from 'sequelize';
import { expectedString } from '@stringfield/pv';
import { defaultSlaHours, type FaultCategory, type Priority, type WorkOrderStatus } from '@stringfield/shared';
import { DiodeReplacement, ModuleModel, PvString, Site, StringCheck, User, WorkOrder, sequelize } from '../src/models/index.ts';
import { reserveNumbers } from '../src/services/work-orders.service.ts';
import { REPEAT_BACKFILL_SQL } from '../src/lib/repeat-faults.ts';
import { DemoCheckBook, noise, readingValues, scheduleBefore, scheduleFrom, type Fault, type Reading, type TimedReading } from './demo-readings.ts';
import { clearSkyPoaWm2, moduleTempC } from './demo-sky.ts';
import { seedPhotos, seedSignOffs, type ThermalSurvey } from './demo-evidence.ts';

type Step = { to: WorkOrderStatus; by: string; hoursAfterReport: number; reason?: string };
type DemoTicket = {
  site: string;
  strings: Array<[label: string, symptom: string]>;
  faultCategory: FaultCategory;
  priority: Priority;
  title: string;
  description: string;
  source: 'monitoring_alert' | 'inspection' | 'customer_call' | 'other';
  reportedAt: Date;
  assignee?: string;
  steps: Step[];
  /** Field readings of the ticket, already placed in daylight; the steps are fitted around them. */
  readings?: TimedReading[];
  /** A bypass-diode replacement between the before and the after reading (module and diode position). */
  diode?: { modulePosition: number; diodePosition: number };
  /** A thermal image attached when the ticket was raised, with the reading its thermographer noted. */
  thermal?: ThermalSurvey;
  /** Why the supervisor signed off over a string whose after check is not "pass" (by string label). */
  overrideReasons?: Record<string, string>;
  signOffComment?: string;
};

const D = 'dispatcher@stringfield.test';
const S = 'supervisor@stringfield.test';
const T = 'tech@stringfield.test';
const techs = [T, 'rosa.quill@stringfield.test', 'tomas.brenn@stringfield.test', 'ada.merrow@stringfield.test'];

type Times = { inField: number; submitted: number };
const defaultTimes: Times = { inField: 3, submitted: 6 };

/** The steps of a ticket up to `until`, in hours after the report; `times` places the field visit. */
function lifecycle(assignee: string, until: WorkOrderStatus, opts: { returned?: string; times?: Times; signedOff?: number } = {}): Step[] {
  const { inField, submitted } = opts.times ?? defaultTimes;
  const steps: Step[] = [{ to: 'dispatched', by: D, hoursAfterReport: 0.5 }];
  if (until === 'dispatched') return steps;
  steps.push({ to: 'in_field', by: assignee, hoursAfterReport: inField });
  if (until === 'in_field') return steps;
  steps.push({ to: 'awaiting_signoff', by: assignee, hoursAfterReport: submitted });
  if (opts.returned) {
    steps.push({ to: 'returned', by: S, hoursAfterReport: submitted + 3, reason: opts.returned });
    if (until === 'returned') return steps;
    steps.push({ to: 'in_field', by: assignee, hoursAfterReport: submitted + 14 }, { to: 'awaiting_signoff', by: assignee, hoursAfterReport: submitted + 17 });
  }
  if (until === 'awaiting_signoff') return steps;
  steps.push({ to: 'signed_off', by: S, hoursAfterReport: opts.signedOff ?? submitted + (opts.returned ? 21 : 4) });
  return steps;
}

const hoursBetween = (from: Date, to: Date) => (to.getTime() - from.getTime()) / 3_600_000;
/** In the field 20 minutes before the first reading, submitted half an hour after the last. */
const timesOf = (reportedAt: Date, readings: TimedReading[]): Times => ({
  inField: Math.max(0.6, hoursBetween(reportedAt, addMinutes(readings[0]!.at, -20))),
  submitted: hoursBetween(reportedAt, addMinutes(readings.at(-1)!.at, 30)),
});

const before = (label: string, fault: Fault, notes = ''): Reading => ({ label, phase: 'before', fault, notes });
const after = (label: string, gapMin?: number, notes = ''): Reading => ({ label, phase: 'after', fault: { kind: 'healthy' }, notes, ...(gapMin ? { gapMin } : {}) });

/** Voc and Isc of every string of the given inverters, input by input, as an inspection walks them. */
function inspectionRound(inverters: number[], odd: Record<string, [Fault, string, string?]>): Reading[] {
  const out: Reading[] = [];
  for (const inv of inverters) {
    for (let input = 1; input <= 6; input += 1) {
      for (let s = 1; s <= 4; s += 1) {
        const label = `INV${String(inv).padStart(2, '0')}-MPPT${input}-S${s}`;
        const gapMin = s > 1 ? 3 : input > 1 ? 6 : 20;
        const [fault, notes] = odd[label] ?? [{ kind: 'healthy' }, ''];
        out.push({ label, phase: 'after', fault, notes, gapMin });
      }
    }
  }
  return out;
}

const historyFaults: Partial<Record<FaultCategory, Fault>> = {
  fuse: { kind: 'open' },
  connector_cable_damage: { kind: 'isc', pct: -15 },
  bypass_diode_failure: { kind: 'substrings', count: 1 },
  shading_soiling: { kind: 'isc', pct: -10 },
  open_circuit: { kind: 'open' },
  low_current: { kind: 'isc', pct: -9 },
};

const subMinutesDate = (d: Date, minutes: number) => addMinutes(d, -minutes);
const volts = (v: number) => `${v < 0 ? '−' : ''}${Math.round(Math.abs(v)).toLocaleString('en-GB')} V`;

function demoTickets(now: Date, modules: Map<string, ModuleModel>): DemoTicket[] {
  const fwmRound = (inverters: number[], odd: Record<string, [Fault, string, string?]>) => ({ site: 'FWM', readings: inspectionRound(inverters, odd), minWm2: 250 });
  const reasonsOf = (odd: Record<string, [Fault, string, string?]>) => Object.fromEntries(Object.entries(odd).flatMap(([label, [, , reason]]) => (reason ? [[label, reason]] : [])));

  // A routine inspection of INV11–INV12 a week before the storm that later killed a string there.
  const recentOdd: Record<string, [Fault, string, string]> = {
    'INV11-MPPT4-S4': [{ kind: 'cloud' }, 'Cloud over the reference cell during the Isc test.', 'Isc read under a passing cloud; Voc matches its neighbours. Isc to be re-read at the next inspection.'],
    'INV12-MPPT1-S3': [{ kind: 'no_temp' }, 'Temperature probe came off; Voc to be re-checked at the next visit.', 'No module temperature, so Voc cannot be judged; Isc is in line with its neighbours. Voc re-check booked for the next visit.'],
  };
  const recentRound = scheduleBefore(fwmRound([11, 12], recentOdd), subDays(now, 9), null)!;
  const recentReportedAt = subDays(recentRound[0]!.at, 3);
  const recentSubmitted = addMinutes(recentRound.at(-1)!.at, 30);
  const recentSignedOffAt = addHours(recentSubmitted, 20);
  const olderOdd: Record<string, [Fault, string, string]> = {
    'INV02-MPPT6-S4': [{ kind: 'cloud' }, 'Cloud during the Isc test; Voc fine.', 'Isc read under a passing cloud; Voc is fine and the string produces like its neighbours on the monitoring.'],
  };
  const olderRound = scheduleFrom(fwmRound([1, 2], olderOdd), subDays(now, 41));
  const olderReportedAt = subDays(olderRound[0]!.at, 6);

  const inspections: DemoTicket[] = [
    {
      site: 'FWM', strings: recentRound.map((r) => [r.label, 'Annual string inspection']), faultCategory: 'other', priority: 'P4',
      title: 'Annual string inspection, INV11–INV12', description: 'Voc and Isc of every string on INV11 and INV12, with irradiance and module temperature.',
      source: 'inspection', reportedAt: recentReportedAt, assignee: 'rosa.quill@stringfield.test', readings: recentRound,
      overrideReasons: reasonsOf(recentOdd), signOffComment: 'Inspection complete; two readings to repeat at the next visit (see the overrides).',
      steps: lifecycle('rosa.quill@stringfield.test', 'signed_off', { times: timesOf(recentReportedAt, recentRound), signedOff: hoursBetween(recentReportedAt, recentSignedOffAt) }),
    },
    {
      site: 'FWM', strings: olderRound.map((r) => [r.label, 'Annual string inspection']), faultCategory: 'other', priority: 'P4',
      title: 'Annual string inspection, INV01–INV02', description: 'Voc and Isc of every string on INV01 and INV02, with irradiance and module temperature.',
      source: 'inspection', reportedAt: olderReportedAt, assignee: 'tomas.brenn@stringfield.test', readings: olderRound,
      overrideReasons: reasonsOf(olderOdd), signOffComment: 'Inspection complete; one Isc to repeat at the next visit.',
      steps: lifecycle('tomas.brenn@stringfield.test', 'signed_off', { times: timesOf(olderReportedAt, olderRound) }),
    },
  ];

  const diodeReportedAt = subHours(now, 30);
  const diodeVisit = scheduleFrom(
    { site: 'FWM', minWm2: 300, readings: [before('INV07-MPPT3-S2', { kind: 'substrings', count: 1 }), after('INV07-MPPT3-S2', 50, 'After replacing bypass diode 2 of module 9.')] },
    addHours(diodeReportedAt, 1.5),
  );

  // In the field now: the visit is the latest one with good light since dispatch (or just before, if the
  // nights were long; the report then moves back so that dispatch still comes first).
  const lowVocPlan = { site: 'OSR', minWm2: 300, readings: [before('INV03-MPPT4-S1', { kind: 'modules', count: 2 }, 'Voc low on the re-test; count the modules at the next box.')] };
  let lowVocReportedAt = subHours(now, 20);
  let lowVocVisit = scheduleBefore(lowVocPlan, subMinutesDate(now, 30), addHours(lowVocReportedAt, 1));
  if (!lowVocVisit) {
    lowVocVisit = scheduleBefore(lowVocPlan, subMinutesDate(now, 30), null)!;
    lowVocReportedAt = subHours(lowVocVisit[0]!.at, 1.5);
  }

  // Reported by phone, nobody assigned: no check can be recorded on it yet, so the reading is in the text.
  const polarityReportedAt = subHours(now, 1);
  const polarityAt = scheduleBefore({ site: 'OSR', minWm2: 300, readings: [before('INV05-MPPT2-S4', { kind: 'healthy' })] }, subMinutesDate(polarityReportedAt, 10), null)![0]!.at;
  const osrModule = modules.get('SDM-405-72M')!;
  const polarityG = clearSkyPoaWm2('OSR', polarityAt);
  const polarityVocV = -expectedString({ module: osrModule.toSpec(), modulesInSeries: 25, irradianceWm2: polarityG, moduleTempC: moduleTempC('OSR', polarityAt, polarityG, osrModule.noctC ?? 45) }).vocV;

  // The thermal survey flew in the morning's good light; the ticket was raised from its report.
  const thermalReportedAt = subHours(now, 8);
  // A thermal survey wants 600 W/m² or more (IEC TS 62446-3, from memory); in winter the best light there is.
  const thermalAt = [600, 400, 250]
    .map((minWm2) => scheduleBefore({ site: 'CBD', minWm2, readings: [before('INV09-MPPT1-S2', { kind: 'healthy' })] }, subMinutesDate(thermalReportedAt, 40), null))
    .find((v) => v !== null)![0]!.at;

  const soilingReportedAt = subDays(now, 3);
  const soiled: Array<[string, number]> = [['INV04-MPPT1-S1', -12], ['INV04-MPPT1-S2', -12], ['INV04-MPPT2-S1', -11], ['INV04-MPPT2-S2', -12]];
  const soilingVisit = scheduleFrom(
    {
      site: 'CBD',
      minWm2: 420, // the fault is in the current: Isc needs at least 400 W/m²
      readings: [
        ...soiled.map(([label, pct]) => before(label, { kind: 'isc', pct })),
        ...soiled.map(([label], i) => after(label, i === 0 ? 90 : 4, i === 0 ? 'After cleaning the row.' : '')),
      ],
    },
    addHours(soilingReportedAt, 1.5),
  );

  const open: DemoTicket[] = [
    {
      site: 'FWM', strings: [['INV07-MPPT3-S2', 'Voc 16.6 V below its neighbours at STC, about one substring']], faultCategory: 'bypass_diode_failure', priority: 'P2',
      title: 'One substring short on INV07-MPPT3-S2', description: 'Monitoring shows the string about 1/78 low in voltage. Suspected shorted bypass diode.',
      source: 'monitoring_alert', reportedAt: diodeReportedAt, assignee: T, readings: diodeVisit, diode: { modulePosition: 9, diodePosition: 2 },
      steps: lifecycle(T, 'awaiting_signoff', { times: timesOf(diodeReportedAt, diodeVisit) }),
    },
    {
      // Raised by string monitoring, not yet visited: nobody has measured it, so there is no check yet.
      site: 'FWM', strings: [['INV12-MPPT5-S3', '0 A at CB-12B position 7 since the storm (string monitoring)']], faultCategory: 'fuse', priority: 'P2',
      title: 'String dead after storm: blown fuse in CB-12B?', description: 'String current zero since the storm on Sunday night.',
      source: 'monitoring_alert', reportedAt: subHours(now, 5), assignee: T, steps: lifecycle(T, 'dispatched'),
    },
    {
      site: 'OSR', strings: [['INV03-MPPT4-S1', 'Voc about two modules short']], faultCategory: 'low_voltage', priority: 'P2',
      title: 'INV03-MPPT4-S1 about two modules short', description: 'Commissioning re-test found low Voc; possibly two modules bypassed by a wiring error.',
      source: 'inspection', reportedAt: lowVocReportedAt, assignee: T, readings: lowVocVisit, steps: lifecycle(T, 'in_field', { times: timesOf(lowVocReportedAt, lowVocVisit) }),
    },
    {
      site: 'OSR', strings: [['INV05-MPPT2-S4', 'Negative Voc at the inverter input']], faultCategory: 'reverse_polarity', priority: 'P1',
      title: 'Reversed polarity on INV05-MPPT2-S4',
      description: `Reading of ${volts(polarityVocV)} at the inverter's DC input at ${polarityAt.toLocaleTimeString('en-GB', { timeZone: 'America/Edmonton', hour: '2-digit', minute: '2-digit' })} local time, ${Math.round(polarityG)} W/m². Do not close the DC switch.`,
      source: 'inspection', reportedAt: polarityReportedAt, steps: [],
    },
    {
      site: 'CBD', strings: [['INV04-MPPT1-S1', 'Isc 12 % low, Voc normal'], ['INV04-MPPT1-S2', 'Isc 12 % low, Voc normal'], ['INV04-MPPT2-S1', 'Isc 11 % low, Voc normal'], ['INV04-MPPT2-S2', 'Isc 12 % low, Voc normal']],
      faultCategory: 'shading_soiling', priority: 'P3', title: 'Soiling on the INV04 roof row', description: 'Dust from the building site next door; clean and re-test.',
      source: 'inspection', reportedAt: soilingReportedAt, assignee: T, readings: soilingVisit,
      steps: lifecycle(T, 'returned', { returned: 'Missing after photos of the cleaned row; add one per string.', times: timesOf(soilingReportedAt, soilingVisit) }),
    },
    {
      site: 'CBD', strings: [['INV09-MPPT1-S2', 'Junction box 28 K above its neighbours in the thermal survey']], faultCategory: 'hot_spot', priority: 'P2',
      title: 'Hot junction box on INV09-MPPT1-S2', description: 'Thermal survey: junction box of module 7 at 71 °C, neighbours 43 °C, 820 W/m².',
      source: 'inspection', reportedAt: thermalReportedAt, steps: [],
      thermal: { by: 'ada.merrow@stringfield.test', at: thermalAt, modulePosition: 7, hottestC: 71, referenceC: 43, irradianceWm2: 820 },
    },
  ];
  const categories: FaultCategory[] = ['fuse', 'connector_cable_damage', 'bypass_diode_failure', 'shading_soiling', 'open_circuit', 'low_current'];
  const closed = (site: string, label: string, category: FaultCategory, reportedAt: Date, assignee: string, returned?: string) => {
    const visit = scheduleFrom({ site, minWm2: 420, readings: [before(label, historyFaults[category]!), after(label, 45)] }, addHours(reportedAt, 2));
    return { readings: visit, steps: lifecycle(assignee, 'signed_off', { times: timesOf(reportedAt, visit), ...(returned ? { returned } : {}) }) };
  };
  const history: DemoTicket[] = Array.from({ length: 12 }, (_, i) => {
    const site = ['FWM', 'OSR', 'CBD'][i % 3]!;
    const label = site === 'FWM' ? `INV${String(3 + (i % 5)).padStart(2, '0')}-MPPT1-S1` : site === 'OSR' ? `INV0${1 + (i % 7)}-MPPT2-S2` : `INV0${1 + (i % 9)}-MPPT2-S1`;
    const category = categories[i % categories.length]!;
    const assignee = techs[i % techs.length]!;
    const reportedAt = subDays(now, 85 - i * 7);
    return {
      site,
      strings: [[label, 'Reported by monitoring']],
      faultCategory: category,
      priority: (['P2', 'P3', 'P2', 'P4'] as const)[i % 4]!,
      title: `${label}: ${category.replace(/_/g, ' ')}`,
      description: 'Closed demo ticket for the metrics.',
      source: 'monitoring_alert',
      reportedAt,
      assignee,
      ...closed(site, label, category, reportedAt, assignee, i === 4 ? 'Insulation reading missing.' : undefined),
    };
  });
  // A repeat fault: the first closed FWM string fails again within 90 days of its sign-off.
  const first = history[0]!;
  const repeatAt = subDays(now, 12);
  history.push({ ...first, title: `${first.strings[0]![0]}: fuse blown again`, reportedAt: repeatAt, assignee: T, ...closed(first.site, first.strings[0]![0], 'fuse', repeatAt, T) });
  return [...history, ...inspections, ...open];
}

/** The open work and closed history of the demo scenario; skipped when the database has tickets already. */
export async function seedDemoWorkOrders(transaction: Transaction): Promise<number> {
  if ((await WorkOrder.count({ transaction })) > 0) return 0;
  const now = new Date();
  const users = new Map((await User.findAll({ transaction })).map((u) => [u.email, u]));
  const sites = new Map((await Site.findAll({ transaction })).map((s) => [s.code, s]));
  const moduleRows = await ModuleModel.findAll({ transaction });
  const tickets = demoTickets(now, new Map(moduleRows.map((m) => [m.model, m]))).sort((a, b) => a.reportedAt.getTime() - b.reportedAt.getTime());
  const qi = sequelize.getQueryInterface();
  const fieldWork: Array<{ wo: WorkOrder; t: DemoTicket; strings: Map<string, PvString> }> = [];
  // Signed-off history goes through the sign-off service once its evidence is in: seeded awaiting sign-off.
  const toSignOff: Array<{ wo: WorkOrder; t: DemoTicket; step: Step; strings: PvString[] }> = [];
  for (const t of tickets) {
    const site = sites.get(t.site);
    if (!site) continue;
    const strings = await PvString.findAll({ where: { siteId: site.id, label: t.strings.map(([l]) => l) }, transaction });
    if (strings.length !== t.strings.length) continue;
    const [number] = await reserveNumbers(t.reportedAt.getUTCFullYear(), 1, transaction);
    const at = (h: number) => addHours(t.reportedAt, h);
    const finalStatus: WorkOrderStatus = t.steps.at(-1)?.to ?? 'reported';
    const signOffStep = finalStatus === 'signed_off' ? t.steps.at(-1)! : null;
    const steps = signOffStep ? t.steps.slice(0, -1) : t.steps;
    const status: WorkOrderStatus = steps.at(-1)?.to ?? 'reported';
    const stamp = (s: WorkOrderStatus) => steps.filter((x) => x.to === s).at(-1);
    const wo = await WorkOrder.create(
      {
        number: number!,
        siteId: site.id,
        faultCategory: t.faultCategory,
        priority: t.priority,
        title: t.title,
        description: t.description,
        source: t.source,
        status,
        reportedAt: t.reportedAt,
        dueAt: addHours(t.reportedAt, defaultSlaHours[t.priority]),
        assigneeId: t.assignee ? users.get(t.assignee)!.id : null,
        createdById: users.get(D)!.id,
        dispatchedAt: stamp('dispatched') ? at(stamp('dispatched')!.hoursAfterReport) : null,
        submittedAt: stamp('awaiting_signoff') ? at(stamp('awaiting_signoff')!.hoursAfterReport) : null,
        signedOffAt: null,
        returnReason: t.steps.find((s) => s.to === 'returned')?.reason ?? null,
        returnCount: t.steps.filter((s) => s.to === 'returned').length,
        // Historical tickets were overdue long ago; they need no overdue mail now.
        overdueNotifiedAt: finalStatus === 'signed_off' ? at(1) : null,
      },
      { transaction },
    );
    await qi.bulkInsert(
      'work_order_strings',
      strings.map((s) => ({ work_order_id: wo.id, string_id: s.id, symptom: t.strings.find(([l]) => l === s.label)![1] })),
      { transaction },
    );
    let from: WorkOrderStatus = 'reported';
    const events = [
      { work_order_id: wo.id, actor_id: users.get(D)!.id, type: 'created', from_status: null, to_status: 'reported', changes: null, comment: null, created_at: t.reportedAt },
      ...steps.map((s) => {
        const e = {
          work_order_id: wo.id,
          actor_id: users.get(s.by)!.id,
          type: 'transition',
          from_status: from,
          to_status: s.to,
          changes: s.to === 'dispatched' && t.assignee ? JSON.stringify({ assignee: { from: null, to: users.get(t.assignee)!.name } }) : null,
          comment: s.reason ?? null,
          created_at: at(s.hoursAfterReport),
        };
        from = s.to;
        return e;
      }),
    ];
    await qi.bulkInsert('work_order_events', events, { transaction });
    if (t.readings?.length || t.thermal) fieldWork.push({ wo, t, strings: new Map(strings.map((s) => [s.label, s])) });
    if (signOffStep) toSignOff.push({ wo, t, step: signOffStep, strings });
  }
  const sitesById = new Map([...sites.values()].map((s) => [s.id, s]));
  const checks = await seedReadings(fieldWork.filter(({ t }) => t.readings?.length), users, new Map(moduleRows.map((m) => [m.id, m])), transaction);
  const photos = await seedPhotos(
    fieldWork.map(({ wo, t, strings }) => ({
      wo,
      site: t.site,
      timeZone: sitesById.get(wo.siteId)!.timeZone,
      reportedAt: t.reportedAt,
      strings,
      checks: checks.filter((c) => c.workOrderId === wo.id),
      finalStatus: t.steps.at(-1)?.to ?? 'reported',
      technicianId: t.assignee ? users.get(t.assignee)!.id : null,
      ...(t.diode ? { diode: { label: t.strings[0]![0], ...t.diode, at: diodeTime(t) } } : {}),
      ...(t.thermal ? { thermal: { ...t.thermal, uploadedById: users.get(t.thermal.by)!.id } } : {}),
    })),
    transaction,
  );
  await seedDiodeReplacements(fieldWork, checks, photos, users, transaction);
  await seedSignOffs(
    toSignOff.map(({ wo, t, step, strings }) => ({
      wo,
      supervisorId: users.get(step.by)!.id,
      at: addHours(t.reportedAt, step.hoursAfterReport),
      comment: t.signOffComment ?? '',
      flagged: strings
        .filter((s) => checks.filter((c) => c.workOrderId === wo.id && c.stringId === s.id && c.phase === 'after').at(-1)?.verdict !== 'pass')
        .map((s) => ({ stringId: s.id, label: s.label, reason: t.overrideReasons?.[s.label] ?? null })),
    })),
    transaction,
  );
  await sequelize.query(REPEAT_BACKFILL_SQL, { transaction });
  return tickets.length;
}

/** Healthy strings read a little under the datasheet Isc: soiling and ageing, more on the older plants (demo). */
const healthyIscPct: Record<string, number> = { FWM: -1, OSR: -1.5, CBD: -2.5 };

/**
 * The readings of the demo tickets, judged by the field-checks computation in the order they were taken
 * (so peers are what the API would have found), then one bulk insert.
 */
async function seedReadings(
  fieldWork: Array<{ wo: WorkOrder; t: DemoTicket; strings: Map<string, PvString> }>,
  users: Map<string, User>,
  modules: Map<number, ModuleModel>,
  transaction: Transaction,
): Promise<StringCheck[]> {
  const all = fieldWork.flatMap(({ wo, t, strings }) => t.readings!.map((r) => ({ wo, t, r, string: strings.get(r.label)! })));
  all.sort((a, b) => a.r.at.getTime() - b.r.at.getTime());
  const byId = new Map(all.map((x) => [x.string.id, x.string]));
  const book = new DemoCheckBook(byId, modules);
  const rand = noise(20_260_601);
  for (const { wo, t, r, string } of all) {
    const values = readingValues(t.site, r.at, string, modules.get(string.moduleModelId)!, r.fault, rand, healthyIscPct[t.site] ?? 0);
    const row = book.add({ workOrderId: wo.id, technicianId: users.get(t.assignee!)!.id, string, phase: r.phase, at: r.at, values, ...(r.notes ? { notes: r.notes } : {}) });
    // Saved from the phone a few seconds after the reading.
    row.createdAt = addMinutes(r.at, 0.1);
    row.updatedAt = row.createdAt;
  }
  return StringCheck.bulkCreate(book.rows, { transaction });
}

/** The diode change is noted ten minutes before the after reading. */
const diodeTime = (t: DemoTicket) => addMinutes(t.readings!.at(-1)!.at, -10);

/** The bypass-diode replacement records, linked to their before and after photos. */
async function seedDiodeReplacements(
  fieldWork: Array<{ wo: WorkOrder; t: DemoTicket; strings: Map<string, PvString> }>,
  checks: StringCheck[],
  photos: Awaited<ReturnType<typeof seedPhotos>>,
  users: Map<string, User>,
  transaction: Transaction,
): Promise<void> {
  const diodes = fieldWork.filter(({ t }) => t.diode);
  await DiodeReplacement.bulkCreate(
    diodes.map(({ wo, t, strings }) => {
      const string = strings.get(t.strings[0]![0])!;
      const vocOf = (phase: 'before' | 'after') => checks.find((c) => c.workOrderId === wo.id && c.phase === phase)?.vocV ?? null;
      const at = diodeTime(t);
      const linked = photos.diodePhotos.get(wo.id);
      return {
        workOrderId: wo.id,
        stringId: string.id,
        modulePosition: t.diode!.modulePosition,
        moduleSerial: `SDM550H-2305-${String(40_000 + string.id * 7 + t.diode!.modulePosition).padStart(6, '0')}`,
        diodePosition: t.diode!.diodePosition,
        failureMode: 'short',
        foundBy: 'voc_deficit',
        removedPartJson: JSON.stringify({ partNumber: 'SDM-BPD-30SQ045', ratingA: 30, ratingV: 45, type: 'schottky' }),
        installedPartJson: JSON.stringify({ partNumber: 'SDM-BPD-30SQ045', ratingA: 30, ratingV: 45, type: 'schottky' }),
        newDiodeForwardV: 0.41,
        vocBeforeV: vocOf('before'),
        vocAfterV: vocOf('after'),
        beforePhotoId: linked?.beforePhotoId ?? null,
        afterPhotoId: linked?.afterPhotoId ?? null,
        notes: `Module ${t.diode!.modulePosition} read one substring low at its own terminals; diode ${t.diode!.diodePosition} read 0 V in diode-test mode (shorted). Replaced with the same part.`,
        technicianId: users.get(t.assignee!)!.id,
        createdAt: at,
        updatedAt: at,
      };
    }),
    { transaction },
  );
}
