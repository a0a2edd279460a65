import { beforeEach, describe, expect, it } from 'vitest';
import { demoEmail, errorOf, newAgent, resetDatabase, signIn, tokenFromLink, waitForMail } from './helpers.ts';

beforeEach(resetDatabase);

describe('admin user management', () => {
  it('invites a technician by e-mail; the invitation link sets the password and the new user can sign in', async () => {
    const admin = await signIn(demoEmail.admin);
    const since = Date.now() - 5;
    const created = await admin
      .post('/api/users')
      .set('x-csrf-token', admin.csrf)
      .send({ email: 'Nell.Harrow@stringfield.test', name: 'Nell Harrow', role: 'technician' })
      .expect(201);
    expect(created.body).toMatchObject({ email: 'nell.harrow@stringfield.test', role: 'technician', hasPassword: false, isActive: true });

    const mail = await waitForMail('nell.harrow@stringfield.test', /invited/, since);
    expect(mail.text).toContain('Field technician');
    expect(mail.text).toContain('invite=1');
    const token = tokenFromLink(mail.text);

    const guest = await newAgent();
    await guest.post('/api/auth/reset').set('x-csrf-token', guest.csrf).send({ token, password: 'string-check-4711' }).expect(200);
    await guest
      .post('/api/auth/login')
      .set('x-csrf-token', guest.csrf)
      .send({ email: 'nell.harrow@stringfield.test', password: 'string-check-4711' })
      .expect(200);
  });

  it('refuses to invite an address that already has an account (409, on the e-mail field)', async () => {
    const admin = await signIn(demoEmail.admin);
    const res = await admin
      .post('/api/users')
      .set('x-csrf-token', admin.csrf)
      .send({ email: demoEmail.technician, name: 'Someone', role: 'technician' })
      .expect(409);
    expect(errorOf(res).fields?.email).toBeDefined();
  });

  it('refuses an unknown role with a field message', async () => {
    const admin = await signIn(demoEmail.admin);
    const res = await admin
      .post('/api/users')
      .set('x-csrf-token', admin.csrf)
      .send({ email: 'x@stringfield.test', name: 'X', role: 'superuser' })
      .expect(400);
    expect(errorOf(res).fields?.role).toBeDefined();
  });

  it('lists users with paging, a role filter, a text search and a sort', async () => {
    const admin = await signIn(demoEmail.admin);
    const page = await admin.get('/api/users?pageSize=3&page=2&sort=email').expect(200);
    expect(page.body).toMatchObject({ page: 2, pageSize: 3, total: 9 });
    expect(page.body.items).toHaveLength(3);
    const techs = await admin.get('/api/users?role=technician&pageSize=50').expect(200);
    expect(techs.body.total).toBe(4);
    expect(techs.body.items.every((u: { role: string }) => u.role === 'technician')).toBe(true);
    const search = await admin.get('/api/users?q=quill').expect(200);
    expect(search.body.items.map((u: { name: string }) => u.name)).toEqual(['Rosa Quill']);
    const desc = await admin.get('/api/users?sort=-name&pageSize=1').expect(200);
    expect(desc.body.items[0].name).toBe('Tomas Brenn');
    const bad = await admin.get('/api/users?pageSize=500').expect(400);
    expect(errorOf(bad).fields?.pageSize).toMatch(/at most 200/);
  });

  it('changes a role and deactivates a user, whose session ends at once', async () => {
    const admin = await signIn(demoEmail.admin);
    const tech = await signIn(demoEmail.technician);
    const list = await admin.get(`/api/users?q=${encodeURIComponent(demoEmail.technician)}`).expect(200);
    const id = list.body.items[0].id as number;

    const changed = await admin.patch(`/api/users/${id}`).set('x-csrf-token', admin.csrf).send({ role: 'supervisor' }).expect(200);
    expect(changed.body.role).toBe('supervisor');

    const again = await signIn(demoEmail.technician);
    await admin.patch(`/api/users/${id}`).set('x-csrf-token', admin.csrf).send({ isActive: false }).expect(200);
    await tech.get('/api/auth/me').expect(401);
    await again.get('/api/auth/me').expect(401);
  });

  it('will not let an admin deactivate themselves', async () => {
    const admin = await signIn(demoEmail.admin);
    const me = await admin.get('/api/auth/me').expect(200);
    const res = await admin.patch(`/api/users/${me.body.user.id}`).set('x-csrf-token', admin.csrf).send({ isActive: false }).expect(409);
    expect(errorOf(res).message).toMatch(/yourself/);
  });

  it('answers 404 for an unknown user and 400 for a non-numeric id', async () => {
    const admin = await signIn(demoEmail.admin);
    await admin.patch('/api/users/99999').set('x-csrf-token', admin.csrf).send({ name: 'X' }).expect(404);
    await admin.patch('/api/users/abc').set('x-csrf-token', admin.csrf).send({ name: 'X' }).expect(400);
  });

  it('shows captured invitations in the admin outbox', async () => {
    const admin = await signIn(demoEmail.admin);
    const since = Date.now() - 5;
    await admin.post('/api/users').set('x-csrf-token', admin.csrf).send({ email: 'outbox.check@stringfield.test', name: 'Outbox Check', role: 'dispatcher' }).expect(201);
    await waitForMail('outbox.check@stringfield.test', /invited/, since);
    const list = await admin.get('/api/mail?pageSize=50').expect(200);
    const item = list.body.items.find((m: { to: string[] }) => m.to.includes('outbox.check@stringfield.test'));
    expect(item).toBeDefined();
    const full = await admin.get(`/api/mail/${item.id}`).expect(200);
    expect(full.body.text).toContain('Dispatcher');
    await admin.get('/api/mail/..%2F..%2Fetc%2Fpasswd').expect(404);
  });
});
