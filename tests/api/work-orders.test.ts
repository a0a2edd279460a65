import { beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { can, roles, transitionRules, workOrderStatuses, type Role, type WorkOrderStatus } from '@stringfield/shared';
import { User, WorkOrder } from '../../apps/api/src/models/index.ts';
import { sweepOverdue } from '../../apps/api/src/services/overdue-sweep.service.ts';
import { demoEmail, errorOf, resetDatabase, signIn, waitForMail, type Agent } from './helpers.ts';

const agents = {} as Record<Role, Agent>;
let siteIds: Record<string, number>;
let techId: number;
let fwmStrings: Array<{ id: number; label: string }>;

beforeAll(async () => {
  await resetDatabase({ plant: true });
  for (const role of roles) agents[role] = await signIn(demoEmail[role]);
  const sites = await agents.admin.get('/api/sites').expect(200);
  siteIds = Object.fromEntries(sites.body.items.map((s: { code: string; id: number }) => [s.code, s.id]));
  techId = (await User.findOne({ where: { email: demoEmail.technician } }))!.id;
  const strings = await agents.admin.get(`/api/sites/${siteIds.FWM}/strings?q=INV12-MPPT2&pageSize=10`).expect(200);
  fwmStrings = strings.body.items;
});

async function newTicket(overrides: Record<string, unknown> = {}) {
  const res = await agents.dispatcher
    .post('/api/work-orders')
    .set('x-csrf-token', agents.dispatcher.csrf)
    .send({
      siteId: siteIds.FWM,
      strings: [{ stringId: fwmStrings[0]!.id, symptom: 'Voc 0 V at the combiner' }],
      faultCategory: 'fuse',
      priority: 'P2',
      title: 'String reads 0 V after storm',
      source: 'monitoring_alert',
      ...overrides,
    })
    .expect(201);
  return res.body.items[0] as { id: number; number: string; version: number; status: WorkOrderStatus; dueAt: string; reportedAt: string };
}

/** A ticket put straight into a state (assigned to the demo technician), for the state-machine table. */
async function ticketIn(status: WorkOrderStatus) {
  const t = await newTicket();
  await WorkOrder.update({ status, assigneeId: techId }, { where: { id: t.id } });
  return (await WorkOrder.findByPk(t.id))!;
}

function transition(role: Role, id: number, body: Record<string, unknown>) {
  return agents[role].post(`/api/work-orders/${id}/transitions`).set('x-csrf-token', agents[role].csrf).send(body);
}

const bodyFor = (to: WorkOrderStatus) => ({
  to,
  ...(to === 'dispatched' ? { assigneeId: techId } : {}),
  ...(to === 'returned' || to === 'cancelled' ? { reason: 'Missing after photos of the repaired string' } : {}),
});

describe('ticket lifecycle, per role (generated from the declared transition table)', () => {
  const cases = transitionRules.flatMap((rule) =>
    roles.map((role) => ({ from: rule.from[0]!, to: rule.to, role, allowed: can(role, rule.action) })),
  );
  it.each(cases)('$from → $to as $role: allowed $allowed', async ({ from, to, role, allowed }) => {
    const wo = await ticketIn(from);
    const res = await transition(role, wo.id, { ...bodyFor(to), version: wo.version });
    if (role === 'owner') expect(res.status).toBe(404); // owners cannot even see open tickets
    else if (to === 'signed_off' && allowed) {
      // A bare ticket has no evidence: the sign-off gates refuse it (sign-off.test.ts covers the rest).
      expect(res.status).toBe(409);
      expect(res.body.gates.length).toBeGreaterThan(0);
      return;
    } else expect(res.status).toBe(allowed ? 200 : 403);
    if (res.status === 200) {
      expect(res.body.status).toBe(to);
      expect(res.body.version).toBe(wo.version + 1);
      const last = res.body.events.filter((e: { type: string }) => e.type !== 'comment').at(-1);
      expect(last).toMatchObject({ fromStatus: from, toStatus: to });
    }
  });

  const roleFor = (action: string): Role =>
    action === 'workOrders:work' ? 'technician' : action === 'workOrders:review' ? 'supervisor' : 'dispatcher';
  const outOfOrder = workOrderStatuses.flatMap((from) =>
    [...new Map(transitionRules.map((r) => [r.to, r])).values()]
      .filter((r) => !transitionRules.some((other) => other.to === r.to && other.from.includes(from)))
      .map((r) => ({ from, to: r.to, role: roleFor(r.action) })),
  );
  it.each(outOfOrder)('refuses $from → $to (409 with the current state) even for $role', async ({ from, to, role }) => {
    const wo = await ticketIn(from);
    const res = await transition(role, wo.id, { ...bodyFor(to), version: wo.version });
    expect(res.status).toBe(409);
    expect(res.body.current.status).toBe(from);
  });

  it('lets only the assigned technician start the work', async () => {
    const wo = await ticketIn('dispatched');
    await WorkOrder.update({ assigneeId: (await User.findOne({ where: { email: 'rosa.quill@stringfield.test' } }))!.id }, { where: { id: wo.id } });
    const res = await transition('technician', wo.id, { to: 'in_field', version: wo.version }).expect(403);
    expect(errorOf(res).message).toMatch(/Only the technician assigned/);
  });

  it('needs a reason to return or cancel', async () => {
    const wo = await ticketIn('awaiting_signoff');
    const res = await transition('supervisor', wo.id, { to: 'returned', version: wo.version }).expect(400);
    expect(errorOf(res).fields?.reason).toBeDefined();
  });

  it('refuses to assign a dispatcher or a deactivated technician', async () => {
    const t = await newTicket();
    const dispatcherId = (await User.findOne({ where: { email: demoEmail.dispatcher } }))!.id;
    const notTech = await transition('dispatcher', t.id, { to: 'dispatched', assigneeId: dispatcherId, version: t.version }).expect(400);
    expect(errorOf(notTech).fields?.assigneeId).toMatch(/Not a field technician/);
    const ada = (await User.findOne({ where: { email: 'ada.merrow@stringfield.test' } }))!;
    await ada.update({ isActive: false });
    const inactive = await transition('dispatcher', t.id, { to: 'dispatched', assigneeId: ada.id, version: t.version }).expect(400);
    expect(errorOf(inactive).fields?.assigneeId).toMatch(/deactivated/);
    await ada.update({ isActive: true });
  });
});

describe('optimistic locking', () => {
  it('gives the second of two writers a 409 with the fresh ticket', async () => {
    const t = await newTicket();
    const [a, b] = await Promise.all([
      agents.dispatcher.patch(`/api/work-orders/${t.id}`).set('x-csrf-token', agents.dispatcher.csrf).send({ version: t.version, title: 'First writer' }),
      agents.admin.patch(`/api/work-orders/${t.id}`).set('x-csrf-token', agents.admin.csrf).send({ version: t.version, title: 'Second writer' }),
    ]);
    const statuses = [a.status, b.status].sort();
    expect(statuses).toEqual([200, 409]);
    const loser = a.status === 409 ? a : b;
    const winner = a.status === 200 ? a : b;
    expect(loser.body.current.title).toBe(winner.body.title);
    expect(loser.body.current.version).toBe(t.version + 1);
    expect(errorOf(loser).message).toMatch(/Reload/);
  });

  it('refuses a transition sent with a stale version', async () => {
    const t = await newTicket();
    await agents.dispatcher.patch(`/api/work-orders/${t.id}`).set('x-csrf-token', agents.dispatcher.csrf).send({ version: t.version, priority: 'P1' }).expect(200);
    const res = await transition('dispatcher', t.id, { to: 'dispatched', assigneeId: techId, version: t.version }).expect(409);
    expect(res.body.current.priority).toBe('P1');
  });
});

describe('creating tickets', () => {
  it('numbers tickets WO-YYYY-NNNNN and sets the due time from the priority (P2: 24 h)', async () => {
    const t = await newTicket({ reportedAt: '2026-11-30T08:00:00Z' });
    expect(t.number).toMatch(/^WO-2026-\d{5}$/);
    expect(t.dueAt).toBe('2026-12-01T08:00:00.000Z');
  });

  it('follows the site’s own SLA hours once an admin changes them', async () => {
    await agents.admin.put(`/api/sites/${siteIds.FWM}/sla`).set('x-csrf-token', agents.admin.csrf).send({ P1: 2, P2: 12, P3: 48, P4: 120 }).expect(200);
    await agents.dispatcher.put(`/api/sites/${siteIds.FWM}/sla`).set('x-csrf-token', agents.dispatcher.csrf).send({ P1: 1, P2: 1, P3: 1, P4: 1 }).expect(403);
    const t = await newTicket({ reportedAt: '2026-11-30T08:00:00Z' });
    expect(t.dueAt).toBe('2026-11-30T20:00:00.000Z');
    await agents.admin.put(`/api/sites/${siteIds.FWM}/sla`).set('x-csrf-token', agents.admin.csrf).send({ P1: 4, P2: 24, P3: 72, P4: 240 }).expect(200);
  });

  it('bulk-creates one ticket per selected string with consecutive numbers', async () => {
    const res = await agents.dispatcher
      .post('/api/work-orders')
      .set('x-csrf-token', agents.dispatcher.csrf)
      .send({
        siteId: siteIds.FWM,
        mode: 'perString',
        strings: fwmStrings.slice(0, 3).map((s) => ({ stringId: s.id, symptom: 'Isc 12 % below peers' })),
        faultCategory: 'shading_soiling',
        priority: 'P4',
        title: 'Soiling on row 12',
        source: 'inspection',
      })
      .expect(201);
    const numbers = res.body.items.map((t: { number: string }) => Number(t.number.slice(-5)));
    expect(numbers).toEqual([numbers[0], numbers[0] + 1, numbers[0] + 2]);
    expect(res.body.items.map((t: { stringCount: number }) => t.stringCount)).toEqual([1, 1, 1]);
  });

  it('refuses strings of another site and a technician creating tickets', async () => {
    const cbd = await agents.admin.get(`/api/sites/${siteIds.CBD}/strings?pageSize=1`).expect(200);
    const res = await agents.dispatcher
      .post('/api/work-orders')
      .set('x-csrf-token', agents.dispatcher.csrf)
      .send({ siteId: siteIds.FWM, strings: [{ stringId: cbd.body.items[0].id }], faultCategory: 'fuse', priority: 'P3', title: 'Wrong site', source: 'other' })
      .expect(400);
    expect(errorOf(res).fields?.strings).toBeDefined();
    await agents.technician
      .post('/api/work-orders')
      .set('x-csrf-token', agents.technician.csrf)
      .send({ siteId: siteIds.FWM, strings: [{ stringId: fwmStrings[0]!.id }], faultCategory: 'fuse', priority: 'P3', title: 'Not mine to open', source: 'other' })
      .expect(403);
  });
});

describe('the dispatcher board', () => {
  it('filters by status and priority, finds a ticket by string label, and paginates', async () => {
    const t = await newTicket({ priority: 'P1', title: 'Negative Voc at combiner' });
    const byLabel = await agents.dispatcher.get(`/api/work-orders?q=${fwmStrings[0]!.label}&status=reported&priority=P1`).expect(200);
    expect(byLabel.body.items.map((i: { id: number }) => i.id)).toContain(t.id);
    expect(byLabel.body.items.every((i: { status: string; priority: string }) => i.status === 'reported' && i.priority === 'P1')).toBe(true);
    const page = await agents.dispatcher.get('/api/work-orders?pageSize=2&page=1&sort=-number').expect(200);
    expect(page.body.items).toHaveLength(2);
    expect(page.body.total).toBeGreaterThan(2);
    await agents.dispatcher.get('/api/work-orders?status=finished').expect(400);
  });

  it('flags overdue tickets and lets the board filter on them', async () => {
    const t = await newTicket({ priority: 'P1', reportedAt: '2026-01-05T08:00:00Z' });
    const res = await agents.dispatcher.get('/api/work-orders?overdue=true&pageSize=200').expect(200);
    const item = res.body.items.find((i: { id: number }) => i.id === t.id);
    expect(item).toMatchObject({ isOverdue: true });
  });

  it('shows an owner only signed-off tickets of their own sites', async () => {
    const open = await newTicket();
    const done = await ticketIn('signed_off');
    const res = await agents.owner.get('/api/work-orders?pageSize=200').expect(200);
    const ids = res.body.items.map((i: { id: number }) => i.id);
    expect(ids).toContain(done.id);
    expect(ids).not.toContain(open.id);
    expect(res.body.items.every((i: { status: string }) => i.status === 'signed_off')).toBe(true);
    const other = await signIn(demoEmail.otherOwner);
    await other.get(`/api/work-orders/${done.id}`).expect(404);
  });
});

describe('comments and history', () => {
  it('adds a comment to the timeline and records every change as an event', async () => {
    const t = await newTicket();
    await agents.technician.post(`/api/work-orders/${t.id}/comments`).set('x-csrf-token', agents.technician.csrf).send({ body: 'On my way, @rosa.quill can you bring the clamp meter?' }).expect(201);
    await agents.dispatcher.patch(`/api/work-orders/${t.id}`).set('x-csrf-token', agents.dispatcher.csrf).send({ version: t.version, priority: 'P1' }).expect(200);
    const events = await agents.supervisor.get(`/api/work-orders/${t.id}/events`).expect(200);
    const types = events.body.items.map((e: { type: string }) => e.type);
    expect(types).toEqual(['created', 'comment', 'updated']);
    expect(events.body.items[2].changes).toEqual({ priority: { from: 'P2', to: 'P1' } });
    await agents.owner.post(`/api/work-orders/${t.id}/comments`).set('x-csrf-token', agents.owner.csrf).send({ body: 'Owner note' }).expect(403);
  });
});

describe('e-mail notifications', () => {
  beforeEach(async () => {
    await agents.technician.put('/api/me/mail-preferences').set('x-csrf-token', agents.technician.csrf).send({ optOut: [] }).expect(200);
  });

  it('mails the technician on assignment, the supervisors on submission and the technician on return (with the reason)', async () => {
    const since = Date.now() - 5;
    const t = await newTicket({ title: 'Blown fuse CB-12B' });
    const dispatched = await transition('dispatcher', t.id, { to: 'dispatched', assigneeId: techId, version: t.version }).expect(200);
    const assigned = await waitForMail(demoEmail.technician, new RegExp(`${t.number} assigned to you`), since);
    expect(assigned.text).toContain(`/work-orders/${t.id}`);
    expect(assigned.text).toMatch(/lock-out\/tag-out/);
    expect(assigned.html).toContain('Blown fuse CB-12B');

    const started = await transition('technician', t.id, { to: 'in_field', version: dispatched.body.version }).expect(200);
    const submitted = await transition('technician', t.id, { to: 'awaiting_signoff', version: started.body.version }).expect(200);
    const review = await waitForMail(demoEmail.supervisor, new RegExp(`${t.number} is waiting for sign-off`), since);
    expect(review.text).toContain('Demo Technician submitted');

    await transition('supervisor', t.id, { to: 'returned', reason: 'No after photo of the fuse holder', version: submitted.body.version }).expect(200);
    const returned = await waitForMail(demoEmail.technician, new RegExp(`${t.number} was returned`), since);
    expect(returned.text).toContain('Reason: No after photo of the fuse holder');
    const detail = await agents.technician.get(`/api/work-orders/${t.id}`).expect(200);
    expect(detail.body.returnReason).toBe('No after photo of the fuse holder');
  });

  it('sends nothing in a category the user turned off', async () => {
    await agents.technician.put('/api/me/mail-preferences').set('x-csrf-token', agents.technician.csrf).send({ optOut: ['assignment'] }).expect(200);
    const t = await newTicket({ title: 'Quiet assignment' });
    await transition('dispatcher', t.id, { to: 'dispatched', assigneeId: techId, version: t.version }).expect(200);
    await expect(waitForMail(demoEmail.technician, new RegExp(`${t.number} assigned`), 0, 1500)).rejects.toThrow(/No mail/);
  });

  it('tells the dispatchers once when a ticket goes overdue, even if the sweep runs twice', async () => {
    const since = Date.now() - 5;
    const t = await newTicket({ priority: 'P1', title: 'Overdue sweep check', reportedAt: '2026-02-01T08:00:00Z' });
    expect(await sweepOverdue()).toBeGreaterThanOrEqual(1);
    const mail = await waitForMail(demoEmail.dispatcher, new RegExp(`${t.number} is overdue`), since);
    expect(mail.subject).toContain(t.number);
    const again = await Promise.all([sweepOverdue(), sweepOverdue()]);
    expect(again).toEqual([0, 0]);
  });
});
