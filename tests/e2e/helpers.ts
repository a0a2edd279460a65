import { expect, request as apiRequest, type APIResponse, type Page } from '@playwright/test';

export const DEMO_PASSWORD = 'stringfield-demo';
export const demoUsers = {
  admin: 'admin@stringfield.test',
  dispatcher: 'dispatcher@stringfield.test',
  technician: 'tech@stringfield.test',
  supervisor: 'supervisor@stringfield.test',
  owner: 'owner@stringfield.test',
} as const;

export const viewports = {
  phone: { width: 360, height: 780 },
  desktop: { width: 1280, height: 800 },
} as const;

/** Sign in through the form, as a person would. */
export async function signIn(page: Page, email: string, password = DEMO_PASSWORD, path = '/') {
  await page.goto(path);
  await expect(page).toHaveURL(/\/sign-in/);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: /sign in/i }).click();
  await expect(page).not.toHaveURL(/\/sign-in/);
}

export function screenshotPath(name: string) {
  return `tests/e2e/screenshots/${name}.png`;
}

// ---------- API shortcuts, for the set-up a test is not about ----------

type Json = Record<string, unknown>;
/** One file part of a multipart request. */
export type UploadPart = { name: string; mimeType: string; buffer: Buffer };

/** A signed-in API session of one demo user, apart from the browser page (its own cookie jar). */
export type ApiSession = {
  get<T = Json>(path: string): Promise<T>;
  post<T = Json>(path: string, body: unknown): Promise<T>;
  /** A multipart POST (e.g. a photo upload: `files` parts plus a JSON `meta` field). */
  postMultipart<T = Json>(path: string, multipart: Record<string, string | UploadPart>): Promise<T>;
  dispose(): Promise<void>;
};

async function readJson<T>(response: APIResponse, what: string): Promise<T> {
  if (!response.ok()) throw new Error(`${what} answered ${response.status()}: ${await response.text()}`);
  return (await response.json()) as T;
}

/** Signs `email` in through the API (CSRF token first, as the web client does) in a fresh request context. */
export async function apiSignIn(
  email: string,
  options: { baseURL?: string | undefined; password?: string } = {},
): Promise<ApiSession> {
  const baseURL = options.baseURL ?? `http://127.0.0.1:${process.env.E2E_PORT ?? 8091}`;
  const password = options.password ?? DEMO_PASSWORD;
  const ctx = await apiRequest.newContext({ baseURL });
  const csrf = async () =>
    (await readJson<{ csrfToken: string }>(await ctx.get('/api/auth/csrf'), 'GET /api/auth/csrf')).csrfToken;
  await readJson(
    await ctx.post('/api/auth/login', {
      data: { email, password },
      headers: { 'x-csrf-token': await csrf() },
    }),
    `sign-in of ${email}`,
  );
  // The session id changes at sign-in; ask for the token of the new session.
  let token = await csrf();
  return {
    get: async <T>(path: string) => readJson<T>(await ctx.get(path), `GET ${path}`),
    post: async <T>(path: string, body: unknown) => {
      let response = await ctx.post(path, { data: body, headers: { 'x-csrf-token': token } });
      if (response.status() === 403) {
        token = await csrf();
        response = await ctx.post(path, { data: body, headers: { 'x-csrf-token': token } });
      }
      return readJson<T>(response, `POST ${path}`);
    },
    postMultipart: async <T>(path: string, multipart: Record<string, string | UploadPart>) => {
      let response = await ctx.post(path, { multipart, headers: { 'x-csrf-token': token } });
      if (response.status() === 403) {
        token = await csrf();
        response = await ctx.post(path, { multipart, headers: { 'x-csrf-token': token } });
      }
      return readJson<T>(response, `POST ${path}`);
    },
    dispose: () => ctx.dispose(),
  };
}

type Ticket = { id: number; number: string; version: number; status: string; title: string };

/** Site id by its code (FWM, OSR, CBD). */
export async function siteIdByCode(api: ApiSession, code: string): Promise<number> {
  const { items } = await api.get<{ items: Array<{ id: number; code: string }> }>(
    `/api/sites?q=${encodeURIComponent(code)}&pageSize=50`,
  );
  const site = items.find((s) => s.code === code);
  if (!site) throw new Error(`No site ${code}`);
  return site.id;
}

/** String ids of a site by label. */
export async function stringIdsByLabel(
  api: ApiSession,
  siteId: number,
  labels: readonly string[],
): Promise<number[]> {
  const ids: number[] = [];
  for (const label of labels) {
    const { items } = await api.get<{ items: Array<{ id: number; label: string }> }>(
      `/api/sites/${siteId}/strings?q=${encodeURIComponent(label)}&pageSize=50`,
    );
    const found = items.find((s) => s.label === label);
    if (!found) throw new Error(`No string ${label} at site ${siteId}`);
    ids.push(found.id);
  }
  return ids;
}

/** A technician's user id by display name (from the list a dispatcher assigns from). */
export async function technicianId(api: ApiSession, name: string): Promise<number> {
  const { items } = await api.get<{ items: Array<{ id: number; name: string }> }>('/api/technicians');
  const tech = items.find((t) => t.name === name);
  if (!tech) throw new Error(`No technician ${name}`);
  return tech.id;
}

/**
 * Opens a ticket as the dispatcher and dispatches it at once to `assignee` (by display name):
 * status `dispatched`, ready for the technician to start.
 */
export async function openDispatchedTicket(
  dispatcher: ApiSession,
  options: {
    siteCode: string;
    labels: readonly string[];
    title: string;
    assignee?: string;
    priority?: 'P1' | 'P2' | 'P3' | 'P4';
  },
): Promise<Ticket> {
  const siteId = await siteIdByCode(dispatcher, options.siteCode);
  const stringIds = await stringIdsByLabel(dispatcher, siteId, options.labels);
  const assigneeId = await technicianId(dispatcher, options.assignee ?? 'Demo Technician');
  const { items } = await dispatcher.post<{ items: Ticket[] }>('/api/work-orders', {
    siteId,
    strings: stringIds.map((stringId) => ({ stringId, symptom: '' })),
    mode: 'single',
    faultCategory: 'low_voltage',
    priority: options.priority ?? 'P2',
    title: options.title,
    description: 'Opened by an end-to-end test.',
    source: 'monitoring_alert',
    assigneeId,
  });
  const ticket = items[0]!;
  if (ticket.status === 'dispatched') return ticket;
  return dispatcher.post<Ticket>(`/api/work-orders/${ticket.id}/transitions`, {
    to: 'dispatched',
    version: ticket.version,
    assigneeId,
  });
}

/** A short suffix that keeps labels and titles of one run apart from those of the other tests. */
export function uniqueSuffix(): string {
  return `${Date.now().toString(36).slice(-5)}${Math.floor(Math.random() * 36 ** 2).toString(36)}`.toUpperCase();
}

/**
 * A small JPEG made on the spot (sharp): a colour field with a random speckle, so that no two
 * photos of a run share a checksum.
 */
export async function makeJpeg(
  colour: { r: number; g: number; b: number },
  size: { width: number; height: number } = { width: 640, height: 480 },
): Promise<Buffer> {
  const { default: sharp } = await import('sharp');
  const speckle = Buffer.alloc(32 * 32 * 3);
  for (let i = 0; i < speckle.length; i += 1) speckle[i] = Math.floor(Math.random() * 256);
  const tile = await sharp(speckle, { raw: { width: 32, height: 32, channels: 3 } }).png().toBuffer();
  return sharp({ create: { ...size, channels: 3, background: colour } })
    .composite([{ input: tile, top: Math.floor(Math.random() * (size.height - 32)), left: Math.floor(Math.random() * (size.width - 32)) }])
    .jpeg({ quality: 80 })
    .toBuffer();
}

/** The ticket as the API holds it now (its version moves with every change). */
export async function currentTicket(api: ApiSession, id: number): Promise<Ticket> {
  return api.get<Ticket>(`/api/work-orders/${id}`);
}
