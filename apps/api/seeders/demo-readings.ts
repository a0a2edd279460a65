import { randomUUID } from 'node:crypto';
import type { CreationAttributes } from 'sequelize';
import { expectedString } from '@stringfield/pv';
import { stringCheckInputSchema } from '@stringfield/shared';
import type { ModuleModel, PvString, StringCheck } from '../src/models/index.ts';
import { PEER_WINDOW_MS, checkRow, latestPeers, type Peer } from '../src/services/field-checks.service.ts';
import { clearSkyPoaWm2, ambientC, moduleTempC, noonPoaWm2 } from './demo-sky.ts';

/** What a demo reading shows, applied to the engine's expected values at the moment of the reading. */
export type Fault =
  | { kind: 'healthy' }
  | { kind: 'substrings'; count: number } // bypassed substrings: Voc short by count × module Voc ÷ diodes
  | { kind: 'modules'; count: number } // modules missing or shorted
  | { kind: 'open' } // blown fuse or broken conductor: nothing at the terminals
  | { kind: 'isc'; pct: number } // Isc off by pct (negative is low), Voc normal
  | { kind: 'no_temp' } // no module temperature noted (probe off)
  | { kind: 'cloud' }; // a cloud over the reference cell during the Isc test

export type Reading = { label: string; phase: 'before' | 'after'; fault: Fault; gapMin?: number; notes?: string };
export type Visit = { site: string; readings: Reading[]; minWm2: number };
export type TimedReading = Reading & { at: Date };

const MIN = 60_000;
/** Below this irradiance a technician skips the Isc test (IEC 62446-1 I-V test ≥ 400 W/m², from memory). */
const ISC_MIN_WM2 = 400;

/** A small repeatable pseudo-random source (mulberry32), so the demo reads the same on every seed. */
export function noise(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Good light for a visit: near the day's best clear-sky irradiance and at least the visit's minimum. */
const noonByDay = new Map<string, number>();
function isGood(site: string, at: Date, minWm2: number): boolean {
  const dayKey = `${site}|${Math.floor(at.getTime() / (24 * 60 * MIN))}`;
  let noon = noonByDay.get(dayKey);
  if (noon === undefined) {
    noon = noonPoaWm2(site, at);
    noonByDay.set(dayKey, noon);
  }
  return clearSkyPoaWm2(site, at) >= Math.max(minWm2, Math.min(620, 0.88 * noon));
}

const goodSlots = new Map<string, boolean>();
/** The first good light at or after `from`, on a 10-minute grid (remembered, as visits are fitted by trial). */
function nextGood(site: string, from: Date, minWm2: number): Date {
  let t = Math.ceil(from.getTime() / (10 * MIN)) * 10 * MIN;
  for (let i = 0; i < 14 * 24 * 6; i += 1, t += 10 * MIN) {
    const key = `${site}|${minWm2}|${t}`;
    let good = goodSlots.get(key);
    if (good === undefined) {
      good = isGood(site, new Date(t), minWm2);
      goodSlots.set(key, good);
    }
    if (good) return new Date(t);
  }
  throw new Error(`No daylight for demo readings at ${site} after ${from.toISOString()}`);
}

/** Times for a visit's readings from the first good light at or after `from`; a reading that would fall in poor light waits for the next good light. */
export function scheduleFrom(visit: Visit, from: Date): TimedReading[] {
  const out: TimedReading[] = [];
  let t = nextGood(visit.site, from, visit.minWm2);
  for (const [i, r] of visit.readings.entries()) {
    if (i > 0) t = new Date(t.getTime() + (r.gapMin ?? 4) * MIN);
    if (!isGood(visit.site, t, visit.minWm2)) t = nextGood(visit.site, t, visit.minWm2);
    out.push({ ...r, at: t });
  }
  return out;
}

/** The latest visit (to 20 minutes) that ends by `by` and starts at or after `notBefore` (or within 14 days), if any. */
export function scheduleBefore(visit: Visit, by: Date, notBefore: Date | null): TimedReading[] | null {
  const earliest = notBefore?.getTime() ?? by.getTime() - 14 * 24 * 60 * MIN;
  for (let start = by.getTime() - 10 * MIN; start >= earliest; start -= 20 * MIN) {
    // Only a start in good light can be the first reading; anything else would slide forward anyway.
    if (!isGood(visit.site, new Date(start), visit.minWm2)) continue;
    const timed = scheduleFrom(visit, new Date(start));
    if (timed.at(-1)!.at <= by) return timed;
  }
  return null;
}

const round = (x: number, digits: number) => Math.round(x * 10 ** digits) / 10 ** digits;

/** The values a technician would note for a string at a moment, with the fault applied to what the engine expects. */
export function readingValues(site: string, at: Date, s: Pick<PvString, 'modulesInSeries'>, module: ModuleModel, fault: Fault, rand: () => number, healthyIscPct: number) {
  const jitter = (spread: number) => (rand() * 2 - 1) * spread;
  let irradianceWm2 = Math.round(clearSkyPoaWm2(site, at) * (1 + jitter(0.015)));
  if (fault.kind === 'cloud') irradianceWm2 = Math.round(330 + rand() * 50);
  const tempC = round(moduleTempC(site, at, irradianceWm2, module.noctC ?? 45) + jitter(0.8), 1);
  const expected = expectedString({ module: module.toSpec(), modulesInSeries: s.modulesInSeries, irradianceWm2, moduleTempC: tempC });
  const moduleVocV = expected.vocV / s.modulesInSeries;
  // Identical strings agree within a few tenths of a per cent (a substring is 1–1.5 % of a string).
  let vocV = expected.vocV * (1 + jitter(0.0025));
  let iscA: number | undefined = expected.iscA * (1 + (healthyIscPct + jitter(1)) / 100);
  if (fault.kind === 'substrings') vocV -= (fault.count * moduleVocV) / module.bypassDiodes;
  if (fault.kind === 'modules') vocV -= fault.count * moduleVocV;
  if (fault.kind === 'isc') iscA = expected.iscA * (1 + (fault.pct + jitter(0.3)) / 100);
  if (fault.kind === 'open') {
    vocV = 0;
    iscA = 0;
  }
  if (irradianceWm2 < ISC_MIN_WM2 && fault.kind !== 'cloud') iscA = undefined;
  return {
    vocV: round(vocV, 1),
    ...(iscA === undefined ? {} : { iscA: round(iscA, 2) }),
    irradianceWm2,
    irradianceMethod: 'reference_cell' as const,
    ...(fault.kind === 'no_temp' ? {} : { moduleTempC: tempC, moduleTempMethod: 'back_sensor' as const }),
    ambientC: round(ambientC(site, at), 1),
  };
}

type Saved = Pick<StringCheck, 'stringId' | 'vocV' | 'iscA' | 'takenAt'> & { peerKey: string };

/**
 * Builds check rows the way the API stores them: each reading is parsed by the shared schema and judged
 * by the field-checks service's own computation, against the checks of its peer strings saved before it
 * (same inverter input, module and length, within the peer window), in the order they were taken.
 */
export class DemoCheckBook {
  private readonly saved: Saved[] = [];
  readonly rows: Array<CreationAttributes<StringCheck>> = [];

  constructor(
    private readonly strings: Map<number, PvString>,
    private readonly modules: Map<number, ModuleModel>,
  ) {}

  add(args: { workOrderId: number; technicianId: number; string: PvString; phase: 'before' | 'after'; at: Date; values: ReturnType<typeof readingValues>; notes?: string }) {
    const s = args.string;
    const input = stringCheckInputSchema.parse({
      clientId: randomUUID(),
      stringId: s.id,
      phase: args.phase,
      takenAt: args.at.toISOString(),
      ...args.values,
      polarityCorrect: true,
      notes: args.notes ?? '',
    });
    const peerKey = `${s.inverterId}|${s.mpptInput}|${s.moduleModelId}|${s.modulesInSeries}`;
    const t = args.at.getTime();
    const near = this.saved
      .filter((c) => c.peerKey === peerKey && c.stringId !== s.id && Math.abs(c.takenAt.getTime() - t) <= PEER_WINDOW_MS)
      .sort((a, b) => b.takenAt.getTime() - a.takenAt.getTime());
    const labels = new Map(near.map((c) => [c.stringId, this.strings.get(c.stringId)!.label]));
    const peers: Peer[] = latestPeers(near, labels);
    const row = checkRow({ input, workOrderId: args.workOrderId, technicianId: args.technicianId, string: s, module: this.modules.get(s.moduleModelId)!, peers, instruments: [], supersedesId: null });
    this.saved.push({ stringId: s.id, vocV: row.vocV, iscA: row.iscA ?? null, takenAt: row.takenAt, peerKey });
    this.rows.push(row);
    return row;
  }
}
