import { addHours, subDays, subHours } from 'date-fns';
import type { Transaction } from 'sequelize';
import { defaultSlaHours, type FaultCategory, type Priority, type WorkOrderStatus } from '@stringfield/shared';
import { PvString, Site, User, WorkOrder, sequelize } from '../src/models/index.ts';
import { reserveNumbers } from '../src/services/work-orders.service.ts';
import { REPEAT_BACKFILL_SQL } from '../src/lib/repeat-faults.ts';

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
};

const D = 'dispatcher@stringfield.test';
const S = 'supervisor@stringfield.test';
const T = 'tech@stringfield.test';
const techs = [T, 'rosa.quill@stringfield.test', 'tomas.brenn@stringfield.test', 'ada.merrow@stringfield.test'];

function lifecycle(assignee: string, until: WorkOrderStatus, opts: { returned?: string } = {}): Step[] {
  const steps: Step[] = [{ to: 'dispatched', by: D, hoursAfterReport: 0.5 }];
  if (until === 'dispatched') return steps;
  steps.push({ to: 'in_field', by: assignee, hoursAfterReport: 3 });
  if (until === 'in_field') return steps;
  steps.push({ to: 'awaiting_signoff', by: assignee, hoursAfterReport: 6 });
  if (opts.returned) {
    steps.push({ to: 'returned', by: S, hoursAfterReport: 9, reason: opts.returned });
    if (until === 'returned') return steps;
    steps.push({ to: 'in_field', by: assignee, hoursAfterReport: 20 }, { to: 'awaiting_signoff', by: assignee, hoursAfterReport: 23 });
  }
  if (until === 'awaiting_signoff') return steps;
  steps.push({ to: 'signed_off', by: S, hoursAfterReport: opts.returned ? 27 : 10 });
  return steps;
}

function demoTickets(now: Date): DemoTicket[] {
  const open: DemoTicket[] = [
    {
      site: 'FWM', strings: [['INV07-MPPT3-S2', 'Voc 16.6 V below its neighbours at STC, about one substring']], faultCategory: 'bypass_diode_failure', priority: 'P2',
      title: 'One substring short on INV07-MPPT3-S2', description: 'Monitoring shows the string about 1/78 low in voltage. Suspected shorted bypass diode.',
      source: 'monitoring_alert', reportedAt: subHours(now, 30), assignee: T, steps: lifecycle(T, 'awaiting_signoff'),
    },
    {
      site: 'FWM', strings: [['INV12-MPPT2-S3', '0 V and 0 A at CB-12B']], faultCategory: 'fuse', priority: 'P2',
      title: 'String dead after storm: blown fuse in CB-12B?', description: 'String current zero since the storm on Sunday night.',
      source: 'monitoring_alert', reportedAt: subHours(now, 5), assignee: T, steps: lifecycle(T, 'dispatched'),
    },
    {
      site: 'OSR', strings: [['INV03-MPPT4-S1', 'Voc about two modules short']], faultCategory: 'low_voltage', priority: 'P2',
      title: 'INV03-MPPT4-S1 about two modules short', description: 'Commissioning re-test found low Voc; possibly two modules bypassed by a wiring error.',
      source: 'inspection', reportedAt: subHours(now, 20), assignee: T, steps: lifecycle(T, 'in_field'),
    },
    {
      site: 'OSR', strings: [['INV05-MPPT2-S4', 'Negative Voc at the combiner input']], faultCategory: 'reverse_polarity', priority: 'P1',
      title: 'Reversed polarity on INV05-MPPT2-S4', description: 'Reading of −1,190 V at the combiner input. Do not close the fuse holder.',
      source: 'inspection', reportedAt: subHours(now, 1), steps: [],
    },
    {
      site: 'CBD', strings: [['INV04-MPPT1-S1', 'Isc 12 % low, Voc normal'], ['INV04-MPPT1-S2', 'Isc 12 % low, Voc normal'], ['INV04-MPPT2-S1', 'Isc 11 % low, Voc normal'], ['INV04-MPPT2-S2', 'Isc 12 % low, Voc normal']],
      faultCategory: 'shading_soiling', priority: 'P3', title: 'Soiling on the INV04 roof row', description: 'Dust from the building site next door; clean and re-test.',
      source: 'inspection', reportedAt: subDays(now, 3), assignee: T, steps: lifecycle(T, 'returned', { returned: 'Missing after photos of the cleaned row; add one per string.' }),
    },
    {
      site: 'CBD', strings: [['INV09-MPPT1-S2', 'Junction box 28 K above its neighbours in the thermal survey']], faultCategory: 'hot_spot', priority: 'P2',
      title: 'Hot junction box on INV09-MPPT1-S2', description: 'Thermal survey: junction box of module 7 at 71 °C, neighbours 43 °C, 820 W/m².',
      source: 'inspection', reportedAt: subHours(now, 8), steps: [],
    },
  ];
  const history: DemoTicket[] = Array.from({ length: 12 }, (_, i) => {
    const site = ['FWM', 'OSR', 'CBD'][i % 3]!;
    const label = site === 'FWM' ? `INV${String(3 + (i % 5)).padStart(2, '0')}-MPPT1-S1` : site === 'OSR' ? `INV0${1 + (i % 7)}-MPPT2-S2` : `INV0${1 + (i % 9)}-MPPT2-S1`;
    const categories: FaultCategory[] = ['fuse', 'connector_cable_damage', 'bypass_diode_failure', 'shading_soiling', 'open_circuit', 'low_current'];
    const assignee = techs[i % techs.length]!;
    return {
      site,
      strings: [[label, 'Reported by monitoring']],
      faultCategory: categories[i % categories.length]!,
      priority: (['P2', 'P3', 'P2', 'P4'] as const)[i % 4]!,
      title: `${label}: ${categories[i % categories.length]!.replace(/_/g, ' ')}`,
      description: 'Closed demo ticket for the metrics.',
      source: 'monitoring_alert',
      reportedAt: subDays(now, 85 - i * 7),
      assignee,
      steps: lifecycle(assignee, 'signed_off', i === 4 ? { returned: 'Insulation reading missing.' } : {}),
    };
  });
  // A repeat fault: the first closed FWM string fails again within 90 days of its sign-off.
  history.push({ ...history[0]!, title: `${history[0]!.strings[0]![0]}: fuse blown again`, reportedAt: subDays(now, 12), steps: lifecycle(T, 'signed_off'), assignee: T });
  return [...history, ...open];
}

/** The open work and closed history of the demo scenario; skipped when the database has tickets already. */
export async function seedDemoWorkOrders(transaction: Transaction): Promise<number> {
  if ((await WorkOrder.count({ transaction })) > 0) return 0;
  const now = new Date();
  const users = new Map((await User.findAll({ transaction })).map((u) => [u.email, u]));
  const sites = new Map((await Site.findAll({ transaction })).map((s) => [s.code, s]));
  const tickets = demoTickets(now).sort((a, b) => a.reportedAt.getTime() - b.reportedAt.getTime());
  const qi = sequelize.getQueryInterface();
  for (const t of tickets) {
    const site = sites.get(t.site);
    if (!site) continue;
    const strings = await PvString.findAll({ where: { siteId: site.id, label: t.strings.map(([l]) => l) }, transaction });
    if (strings.length !== t.strings.length) continue;
    const [number] = await reserveNumbers(t.reportedAt.getUTCFullYear(), 1, transaction);
    const at = (h: number) => addHours(t.reportedAt, h);
    const last = t.steps.at(-1);
    const status: WorkOrderStatus = last?.to ?? 'reported';
    const stamp = (s: WorkOrderStatus) => t.steps.filter((x) => x.to === s).at(-1);
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
        signedOffAt: stamp('signed_off') ? at(stamp('signed_off')!.hoursAfterReport) : null,
        returnReason: t.steps.find((s) => s.to === 'returned')?.reason ?? null,
        returnCount: t.steps.filter((s) => s.to === 'returned').length,
        // Historical tickets were overdue long ago; they need no overdue mail now.
        overdueNotifiedAt: status === 'signed_off' ? at(1) : null,
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
      ...t.steps.map((s) => {
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
  }
  await sequelize.query(REPEAT_BACKFILL_SQL, { transaction });
  return tickets.length;
}
