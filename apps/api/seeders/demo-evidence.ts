import { addMinutes } from 'date-fns';
import type { Transaction } from 'sequelize';
import {
  photoMetaSchema,
  thermalFindingInputSchema,
  type PhotoMeta,
  type WorkOrderStatus,
} from '@stringfield/shared';
import { ThermalFinding, type PvString, type StringCheck, type WorkOrder } from '../src/models/index.ts';
import {
  processImage,
  storePhotos,
  thermalFindingRow,
  type ProcessedImage,
} from '../src/services/evidence.service.ts';
import { recordSignOff } from '../src/services/sign-off.service.ts';
import { ambientC } from './demo-sky.ts';
import { junctionBoxPhoto, meterPhoto, thermalPhoto } from './demo-photos.ts';

// The demo's photo evidence and sign-offs, through the same services as the API: each generated image
// is checked, re-encoded and sized by the upload pipeline (processImage) and stored with its screen copy
// and thumbnail (storePhotos); thermal findings are classified by the service's rule; and every signed-off
// ticket is signed off by the sign-off service, which refuses while its evidence gates are not met.

export type ThermalSurvey = {
  by: string;
  at: Date;
  modulePosition: number;
  hottestC: number;
  referenceC: number;
  irradianceWm2: number;
};

export type TicketEvidence = {
  wo: WorkOrder;
  site: string;
  timeZone: string;
  reportedAt: Date;
  strings: Map<string, PvString>;
  checks: StringCheck[];
  finalStatus: WorkOrderStatus;
  technicianId: number | null;
  diode?: { label: string; modulePosition: number; diodePosition: number; at: Date };
  thermal?: ThermalSurvey & { uploadedById: number };
};

type Planned = {
  wo: WorkOrder;
  uploadedById: number;
  uploadedAt: Date;
  meta: PhotoMeta;
  name: string;
  draw: () => Promise<Buffer>;
  timeZone: string;
  role?: 'diodeBefore' | 'diodeAfter' | 'thermal';
  thermal?: TicketEvidence['thermal'];
};

const photoMeta = (
  tag: PhotoMeta['tag'],
  string: PvString,
  caption: string,
  modulePosition: number | null = null,
) => photoMetaSchema.parse({ tag, stringId: string.id, modulePosition, caption });

/** What each ticket's photos would be, had a technician taken them: captured, then uploaded a minute or two later. */
function plan(tickets: TicketEvidence[]): Planned[] {
  const out: Planned[] = [];
  for (const t of tickets) {
    const byId = new Map([...t.strings.values()].map((s) => [s.id, s]));
    const base = { wo: t.wo, timeZone: t.timeZone };
    // After-repair photos: the meter at each string's latest after reading, on tickets that went up for
    // sign-off (the soiling ticket was returned for want of them, and stays without).
    if (t.technicianId !== null && (t.finalStatus === 'awaiting_signoff' || t.finalStatus === 'signed_off')) {
      const latest = new Map<number, StringCheck>();
      for (const c of t.checks) if (c.phase === 'after' && !c.supersededById) latest.set(c.stringId, c);
      for (const c of latest.values()) {
        const at = addMinutes(c.takenAt, 1);
        const string = byId.get(c.stringId)!;
        const reading = `Voc ${c.vocV.toFixed(1)} V${c.iscA === null ? '' : `, Isc ${c.iscA.toFixed(2)} A`}`;
        out.push({
          ...base,
          uploadedById: t.technicianId,
          uploadedAt: addMinutes(at, 2),
          meta: photoMeta('after', string, `Meter at ${string.label} after the work: ${reading}`),
          name: `meter-${string.label}.jpg`,
          draw: () =>
            meterPhoto({
              vocV: c.vocV,
              iscA: c.iscA,
              seed: c.stringId * 31 + t.wo.id,
              at,
              timeZone: t.timeZone,
            }),
        });
      }
    }
    if (t.diode && t.technicianId !== null) {
      const d = t.diode;
      const string = t.strings.get(d.label)!;
      const beforeAt = addMinutes(d.at, -20);
      const afterAt = addMinutes(d.at, -2);
      out.push(
        {
          ...base,
          uploadedById: t.technicianId,
          uploadedAt: addMinutes(beforeAt, 1),
          meta: photoMeta(
            'before',
            string,
            `Junction box of module ${d.modulePosition} opened: diode ${d.diodePosition} scorched, 0 V in diode test`,
            d.modulePosition,
          ),
          name: `jb-module-${d.modulePosition}-before.jpg`,
          draw: () =>
            junctionBoxPhoto({
              scorchedDiode: d.diodePosition,
              seed: string.id * 7 + 1,
              at: beforeAt,
              timeZone: t.timeZone,
            }),
          role: 'diodeBefore',
        },
        {
          ...base,
          uploadedById: t.technicianId,
          uploadedAt: addMinutes(afterAt, 1),
          meta: photoMeta(
            'after',
            string,
            `Module ${d.modulePosition}: new bypass diode ${d.diodePosition} in place before the lid went back on`,
            d.modulePosition,
          ),
          name: `jb-module-${d.modulePosition}-after.jpg`,
          draw: () =>
            junctionBoxPhoto({
              newDiode: d.diodePosition,
              seed: string.id * 7 + 2,
              at: afterAt,
              timeZone: t.timeZone,
            }),
          role: 'diodeAfter',
        },
      );
    }
    if (t.thermal) {
      const th = t.thermal;
      const string = [...t.strings.values()][0]!;
      out.push({
        ...base,
        uploadedById: th.uploadedById,
        // Attached from the survey report once the ticket was raised.
        uploadedAt: addMinutes(t.reportedAt, 10),
        meta: photoMeta(
          'thermal',
          string,
          `Junction box of module ${th.modulePosition} at ${th.hottestC} °C, neighbours ${th.referenceC} °C, ${th.irradianceWm2} W/m²`,
          th.modulePosition,
        ),
        name: `thermal-${string.label}-module-${th.modulePosition}.jpg`,
        draw: () =>
          thermalPhoto({
            hottestC: th.hottestC,
            referenceC: th.referenceC,
            ambientC: ambientC(t.site, th.at),
            seed: string.id,
            at: th.at,
            timeZone: t.timeZone,
          }),
        role: 'thermal',
        thermal: th,
      });
    }
  }
  // Ids in upload order, as the API would hand them out.
  return out.sort(
    (a, b) =>
      a.uploadedAt.getTime() - b.uploadedAt.getTime() || a.wo.id - b.wo.id || a.name.localeCompare(b.name),
  );
}

/** Start `job` on every item, at most `limit` running at a time; the promises come back in the items' order. */
function startLimited<T, R>(
  items: T[],
  limit: number,
  job: (item: T, index: number) => Promise<R>,
): Array<Promise<R>> {
  let running = 0;
  const waiting: Array<() => void> = [];
  const slot = async () => {
    if (running >= limit) await new Promise<void>((resolve) => waiting.push(resolve));
    else running += 1;
  };
  const release = () => {
    const next = waiting.shift();
    if (next) next();
    else running -= 1;
  };
  return items.map(async (item, i) => {
    await slot();
    try {
      return await job(item, i);
    } finally {
      release();
    }
  });
}

/**
 * Draw, process and store the demo photos, then the thermal finding of the thermal image. Images are drawn
 * and processed two at a time (the upload pipeline's own limit); each is written, in upload order and in the
 * seed's transaction, as soon as it is ready. Returns the diode photos by ticket, for the replacement records.
 */
export async function seedPhotos(tickets: TicketEvidence[], transaction: Transaction) {
  const planned = plan(tickets);
  const processing: Array<Promise<ProcessedImage>> = startLimited(planned, 2, async (p, i) =>
    processImage(
      { originalname: p.name, buffer: await p.draw(), mimetype: 'image/jpeg' },
      p.meta,
      i,
      p.timeZone,
    ),
  );
  // A failure stops the seed at the first photo it reaches; the ones still in flight must not go unhandled.
  for (const job of processing) job.catch(() => undefined);
  const diodePhotos = new Map<number, { beforePhotoId?: number; afterPhotoId?: number }>();
  for (const [i, p] of planned.entries()) {
    const [row] = await storePhotos(p.wo.id, p.uploadedById, [await processing[i]!], {
      transaction,
      at: p.uploadedAt,
    });
    if (p.role === 'diodeBefore' || p.role === 'diodeAfter') {
      const linked = diodePhotos.get(p.wo.id) ?? {};
      linked[p.role === 'diodeBefore' ? 'beforePhotoId' : 'afterPhotoId'] = row!.id;
      diodePhotos.set(p.wo.id, linked);
    }
    if (p.role === 'thermal' && p.thermal) {
      const { hottestC, referenceC, irradianceWm2, modulePosition } = p.thermal;
      const input = thermalFindingInputSchema.parse({
        hottestC,
        referenceC,
        irradianceWm2,
        pattern: 'junction_box',
        modulePosition,
      });
      const at = addMinutes(p.uploadedAt, 3);
      await ThermalFinding.create(
        { ...thermalFindingRow(row!.id, input), createdAt: at, updatedAt: at },
        { transaction, silent: true },
      );
    }
  }
  return { count: planned.length, diodePhotos };
}

/**
 * `flagged`: the strings whose latest after check is not "pass", with the reason the supervisor signed off
 * over each (the scenario's words; null where it gives none).
 */
export type SignOffPlan = {
  wo: WorkOrder;
  supervisorId: number;
  at: Date;
  comment: string;
  flagged: Array<{ stringId: number; label: string; reason: string | null }>;
};

/**
 * Sign the history off through the sign-off service, in the order it happened. A string whose after check
 * is not "pass" needs an override the scenario explains; anything else missing stops the seed with the
 * service's own 409 rather than writing a sign-off the API would refuse.
 */
export async function seedSignOffs(plans: SignOffPlan[], transaction: Transaction): Promise<void> {
  for (const p of [...plans].sort((a, b) => a.at.getTime() - b.at.getTime())) {
    const overrides = p.flagged.map(({ stringId, label, reason }) => {
      if (!reason)
        throw new Error(
          `Demo seed: the after check of ${label} on ${p.wo.number} is not "pass", and the scenario gives no reason to sign it off anyway.`,
        );
      return { stringId, reason };
    });
    await recordSignOff(p.wo, p.supervisorId, { comment: p.comment, overrides }, p.at, transaction);
  }
}
