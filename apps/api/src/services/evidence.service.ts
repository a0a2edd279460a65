import { createHash, randomUUID } from 'node:crypto';
import sharp, { type Metadata } from 'sharp';
import exifr from 'exifr';
import { classifyThermalAnomaly, type ThermalPattern } from '@stringfield/pv';
import {
  diodeReplacementInputSchema,
  photoMetaSchema,
  type DiodeReplacement as DiodeReplacementDto,
  type DiodeReplacementInput,
  type Photo as PhotoDto,
  type PhotoMeta,
  type SessionUser,
  type ThermalFindingInput,
  workOrderStatusLabels,
} from '@stringfield/shared';
import type { CreationAttributes, Transaction } from 'sequelize';
import { z } from 'zod';
import { env } from '../config/env.ts';
import { AppError, notFound } from '../lib/app-error.ts';
import { logger } from '../lib/logger.ts';
import { onRollback } from '../lib/rollback-hooks.ts';
import { storage } from '../lib/storage.ts';
import { exifDateTimeToDate } from '../lib/zoned-time.ts';
import { DiodeReplacement, Photo, PvString, Site, ThermalFinding, User, WorkOrder, WorkOrderString, sequelize } from '../models/index.ts';
import { findVisibleSite, visibleSiteIds } from './site-access.ts';

// A 12-megapixel phone photo is 4000 × 3000; 50 MP refuses decompression bombs long before memory runs out.
const MAX_INPUT_PIXELS = 50_000_000;
const SIZES = { screen: 1600, thumb: 320 } as const;
const ACCEPTED = new Set(['jpeg', 'png', 'webp']);
// Capture time and its zone (EXIF 2.31 offsets like "+02:00"), and GPS.
const EXIF_TAGS = ['DateTimeOriginal', 'OffsetTimeOriginal', 'CreateDate', 'OffsetTimeDigitized', 'OffsetTime', 'GPSLatitude', 'GPSLongitude', 'GPSLatitudeRef', 'GPSLongitudeRef'] as const;
// Signed file URLs live long enough for the browser to follow the redirect, not to be passed around.
const SIGNED_URL_TTL_S = 60;

// Every upload is a new image, so libvips' operation cache only holds memory; and at most two photos are
// decoded at once in this process, so ten uploads at once queue rather than multiply peak memory.
sharp.cache(false);
const photoJobs = limiter(2);

function limiter(max: number) {
  let active = 0;
  const waiting: Array<() => void> = [];
  return {
    async run<T>(job: () => Promise<T>): Promise<T> {
      // A finished job hands its slot straight to the next waiter, so `active` never exceeds `max`.
      if (active >= max) await new Promise<void>((resolve) => waiting.push(resolve));
      else active += 1;
      try {
        return await job();
      } finally {
        const next = waiting.shift();
        if (next) next();
        else active -= 1;
      }
    },
  };
}

const patternMap: Record<string, ThermalPattern> = {
  single_cell: 'hot-cell',
  substring: 'warm-substring',
  whole_module: 'warm-module',
  junction_box: 'warm-junction-box',
  connector: 'hot-connector',
  diode: 'warm-junction-box',
};

export type UploadFile = { originalname: string; buffer: Buffer; mimetype: string };

export type ProcessedImage = {
  meta: PhotoMeta;
  original: Buffer;
  originalType: string;
  screen: Buffer;
  thumb: Buffer;
  width: number;
  height: number;
  sha256: string;
  capturedAt: Date | null;
  gps: { lat: number; lon: number } | null;
};

/** Check, re-encode and size one uploaded image in memory; throws a 400 naming the file when it is not usable. */
export async function processImage(file: UploadFile, meta: PhotoMeta, index: number, siteTimeZone = 'UTC'): Promise<ProcessedImage> {
  return photoJobs.run(() => processImageNow(file, meta, index, siteTimeZone));
}

async function processImageNow(file: UploadFile, meta: PhotoMeta, index: number, siteTimeZone: string): Promise<ProcessedImage> {
  const name = file.originalname || `file ${index + 1}`;
  let info: Metadata;
  try {
    info = await sharp(file.buffer, { limitInputPixels: MAX_INPUT_PIXELS }).metadata();
  } catch (err) {
    const msg = (err as Error).message;
    if (/pixel limit/i.test(msg)) throw new AppError('VALIDATION_FAILED', `${name} has more than 50 megapixels; send a smaller image.`);
    throw new AppError('VALIDATION_FAILED', `${name} is not an image we can read (JPEG, PNG or WebP).`);
  }
  const format = info.format;
  if (format === 'heif') {
    throw new AppError('VALIDATION_FAILED', `${name} is HEIC, which Stringfield cannot decode yet. Set the phone camera to "Most compatible" (JPEG) or send a JPEG.`);
  }
  if (!format || !ACCEPTED.has(format)) {
    throw new AppError('VALIDATION_FAILED', `${name} is ${format ? format.toUpperCase() : 'not an image'}; send JPEG, PNG or WebP photos.`);
  }
  if ((info.width ?? 0) * (info.height ?? 0) > MAX_INPUT_PIXELS) {
    throw new AppError('VALIDATION_FAILED', `${name} has more than 50 megapixels; send a smaller image.`);
  }
  let exif: Partial<Record<(typeof EXIF_TAGS)[number], unknown>> & { latitude?: number; longitude?: number } | undefined;
  try {
    // reviveValues: false keeps dates as the camera's strings; exifr would read them in this process's zone.
    exif = (await exifr.parse(file.buffer, { pick: [...EXIF_TAGS], gps: true, reviveValues: false })) as typeof exif;
  } catch {
    exif = undefined;
  }
  try {
    // The screen copy is decoded once from the upload (JPEG shrink-on-load) and the thumbnail made from the
    // screen copy, one after the other: two decodes of the original side by side cost 60–90 MB more RSS
    // and were no faster on the 2-core bench machine (tests/load/bench-photo.ts). rotate() applies the EXIF orientation, and sharp writes
    // no metadata unless asked, so the served copies carry no EXIF. The original is kept as uploaded.
    const fit = (px: number) => ({ width: px, height: px, fit: 'inside', withoutEnlargement: true }) as const;
    const screen = await sharp(file.buffer, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'error' }).rotate().resize(fit(SIZES.screen)).jpeg({ quality: 80 }).toBuffer();
    const thumb = await sharp(screen).resize(fit(SIZES.thumb)).jpeg({ quality: 80 }).toBuffer();
    const isQuarterTurn = (info.orientation ?? 1) >= 5;
    const capturedAt =
      exifDateTimeToDate(exif?.DateTimeOriginal, exif?.OffsetTimeOriginal ?? exif?.OffsetTime, siteTimeZone) ??
      exifDateTimeToDate(exif?.CreateDate, exif?.OffsetTimeDigitized ?? exif?.OffsetTime, siteTimeZone);
    return {
      meta,
      original: file.buffer,
      originalType: `image/${format}`,
      screen,
      thumb,
      width: isQuarterTurn ? info.height : info.width,
      height: isQuarterTurn ? info.width : info.height,
      sha256: createHash('sha256').update(file.buffer).digest('hex'),
      capturedAt,
      gps: typeof exif?.latitude === 'number' && typeof exif.longitude === 'number' ? { lat: exif.latitude, lon: exif.longitude } : null,
    };
  } catch (err) {
    logger.info({ err: (err as Error).message, name }, 'image refused');
    throw new AppError('VALIDATION_FAILED', `${name} is damaged or incomplete and could not be read.`);
  }
}

async function ticketForEvidence(user: SessionUser, workOrderId: number): Promise<WorkOrder> {
  const wo = await WorkOrder.findByPk(workOrderId);
  if (!wo) throw notFound('That work order');
  if (wo.assigneeId !== user.id) throw new AppError('FORBIDDEN', `Only the technician assigned to ${wo.number} adds its evidence.`);
  if (wo.status !== 'in_field') throw new AppError('CONFLICT', `${wo.number} is not in the field; evidence is added while the work is under way.`);
  return wo;
}

/**
 * Inside an evidence write's transaction: the ticket read again under a shared lock and still in the field.
 * The lock holds a status change (hand-in, sign-off) back until the write commits, so a piece of evidence is
 * either in before the ticket leaves the field or refused, never saved beside a sign-off that did not see it.
 */
export async function holdInField(workOrderId: number, transaction: Transaction): Promise<void> {
  const wo = await WorkOrder.findByPk(workOrderId, { attributes: ['id', 'number', 'status'], transaction, lock: transaction.LOCK.SHARE });
  if (!wo) throw notFound('That work order');
  if (wo.status !== 'in_field') {
    throw new AppError(
      'CONFLICT',
      `${wo.number} is ${workOrderStatusLabels[wo.status]} now, so nothing was added. To add this, ask the dispatcher or supervisor to send the ticket back to you.`,
      undefined,
      { status: wo.status },
    );
  }
}

export async function visibleTicket(user: SessionUser, workOrderId: number): Promise<WorkOrder> {
  const wo = await WorkOrder.findByPk(workOrderId);
  if (!wo) throw notFound('That work order');
  if (user.role === 'owner') {
    const ids = (await visibleSiteIds(user)) ?? [];
    if (!ids.includes(wo.siteId) || wo.status !== 'signed_off') throw notFound('That work order');
  }
  return wo;
}

function photoUrls(id: number) {
  return { thumb: `/api/photos/${id}/thumb`, screen: `/api/photos/${id}/screen`, original: `/api/photos/${id}/original` };
}

async function photoDtos(rows: Photo[]): Promise<PhotoDto[]> {
  if (rows.length === 0) return [];
  const [users, strings, thermal] = await Promise.all([
    User.findAll({ where: { id: [...new Set(rows.map((r) => r.uploadedById))] }, attributes: ['id', 'name'] }),
    PvString.findAll({ where: { id: [...new Set(rows.map((r) => r.stringId).filter((x): x is number => x !== null))] }, attributes: ['id', 'label'] }),
    ThermalFinding.findAll({ where: { photoId: rows.map((r) => r.id) } }),
  ]);
  const name = new Map(users.map((u) => [u.id, u.name]));
  const label = new Map(strings.map((s) => [s.id, s.label]));
  const findings = new Map(thermal.map((t) => [t.photoId, t]));
  return rows.map((r) => {
    const t = findings.get(r.id);
    return {
      id: r.id,
      workOrderId: r.workOrderId,
      stringId: r.stringId,
      stringLabel: r.stringId ? (label.get(r.stringId) ?? null) : null,
      modulePosition: r.modulePosition,
      tag: r.tag,
      caption: r.caption,
      width: r.width,
      height: r.height,
      bytes: r.bytes,
      sha256: r.sha256,
      capturedAt: r.capturedAt ? r.capturedAt.toISOString() : null,
      gps: r.gpsLat !== null && r.gpsLon !== null ? { lat: r.gpsLat, lon: r.gpsLon } : null,
      uploadedBy: { id: r.uploadedById, name: name.get(r.uploadedById) ?? '' },
      createdAt: r.createdAt.toISOString(),
      urls: photoUrls(r.id),
      thermal: t
        ? {
            hottestC: t.hottestC,
            referenceC: t.referenceC,
            deltaTC: t.hottestC - t.referenceC,
            irradianceWm2: t.irradianceWm2,
            pattern: t.pattern,
            modulePosition: t.modulePosition,
            classOfAbnormality: t.classOfAbnormality,
            isConditionsTooPoor: t.isConditionsTooPoor,
            reason: t.reason,
          }
        : null,
    };
  });
}

/**
 * Upload photos: every file is checked and re-encoded in memory first; only when all of them are good
 * are they written, and a failure while writing removes what was written, so nothing is left half done.
 */
export async function uploadPhotos(user: SessionUser, workOrderId: number, files: UploadFile[], rawMeta: string | undefined): Promise<PhotoDto[]> {
  const wo = await ticketForEvidence(user, workOrderId);
  if (files.length === 0) throw new AppError('VALIDATION_FAILED', 'Attach at least one photo in the form field "files".', { files: 'Choose a photo' });
  let metaList: PhotoMeta[];
  try {
    const parsed: unknown = rawMeta ? JSON.parse(rawMeta) : [];
    metaList = z.array(photoMetaSchema).parse(Array.isArray(parsed) ? parsed : [parsed]);
  } catch (err) {
    if (err instanceof z.ZodError) throw err;
    throw new AppError('VALIDATION_FAILED', 'The "meta" field must be JSON: one { tag, stringId?, modulePosition?, caption? } per file.');
  }
  if (metaList.length !== files.length) {
    throw new AppError('VALIDATION_FAILED', `Send one meta entry per file (${files.length} files, ${metaList.length} entries).`);
  }
  const stringIds = [...new Set(metaList.map((m) => m.stringId).filter((x): x is number => x !== null))];
  if (stringIds.length) {
    const onTicket = await WorkOrderString.count({ where: { workOrderId: wo.id, stringId: stringIds } });
    if (onTicket !== stringIds.length) throw new AppError('VALIDATION_FAILED', `A photo names a string that is not on ${wo.number}.`, { stringId: 'Not on this ticket' });
  }
  // A camera without EXIF offsets records the wall-clock time where it is: the site's.
  const timeZone = (await Site.findByPk(wo.siteId, { attributes: ['id', 'timeZone'] }))?.timeZone ?? 'UTC';
  const processed: ProcessedImage[] = [];
  for (const [i, file] of files.entries()) processed.push(await processImage(file, metaList[i]!, i, timeZone));

  return photoDtos(await storePhotos(wo.id, user.id, processed, { holdInField: true }));
}

async function removeFiles(keys: string[]): Promise<void> {
  await Promise.all(
    keys.map((k) => storage.delete(k).catch((e: unknown) => logger.error({ err: (e as Error).message, key: k }, 'upload clean-up left a file behind'))),
  );
}

/**
 * Store processed photos: three files each, then their rows in one transaction (a savepoint when the caller
 * passes its own); a failure removes the files written, so nothing is left half done. `at` stamps the rows
 * with an upload time other than now (the demo seed writes history).
 */
export async function storePhotos(
  workOrderId: number,
  uploadedById: number,
  processed: ProcessedImage[],
  options: { transaction?: Transaction; at?: Date; holdInField?: boolean } = {},
): Promise<Photo[]> {
  const { at } = options;
  const written: string[] = [];
  try {
    // The files first, outside the transaction: a slow bucket must not hold the ticket's lock.
    const stored: Array<{ p: ProcessedImage; keys: { original: string; screen: string; thumb: string } }> = [];
    for (const p of processed) {
      const stem = `photos/${workOrderId}/${randomUUID()}`;
      const keys = { original: `${stem}-original.${p.originalType.split('/')[1]}`, screen: `${stem}-screen.jpg`, thumb: `${stem}-thumb.jpg` };
      await storage.put(keys.original, p.original, p.originalType);
      written.push(keys.original);
      await storage.put(keys.screen, p.screen, 'image/jpeg');
      written.push(keys.screen);
      await storage.put(keys.thumb, p.thumb, 'image/jpeg');
      written.push(keys.thumb);
      stored.push({ p, keys });
    }
    const rows = await sequelize.transaction({ ...(options.transaction ? { transaction: options.transaction } : {}) }, async (transaction) => {
      if (options.holdInField) await holdInField(workOrderId, transaction);
      const out: Photo[] = [];
      for (const { p, keys } of stored) {
        out.push(
          await Photo.create(
            {
              workOrderId,
              stringId: p.meta.stringId,
              modulePosition: p.meta.modulePosition,
              tag: p.meta.tag,
              caption: p.meta.caption,
              originalKey: keys.original,
              originalType: p.originalType,
              screenKey: keys.screen,
              thumbKey: keys.thumb,
              width: p.width,
              height: p.height,
              bytes: p.original.length,
              sha256: p.sha256,
              capturedAt: p.capturedAt,
              gpsLat: p.gps?.lat ?? null,
              gpsLon: p.gps?.lon ?? null,
              uploadedById,
              ...(at ? { createdAt: at, updatedAt: at } : {}),
            },
            { transaction, silent: Boolean(at) },
          ),
        );
      }
      return out;
    });
    // Inside a caller's transaction the rows can still roll back after this savepoint; the files go with them.
    if (options.transaction) onRollback(options.transaction, () => removeFiles(written));
    return rows;
  } catch (err) {
    await removeFiles(written);
    throw err;
  }
}

export async function listPhotos(user: SessionUser, workOrderId: number): Promise<PhotoDto[]> {
  await visibleTicket(user, workOrderId);
  return photoDtos(await Photo.findAll({ where: { workOrderId }, order: [['id', 'ASC']] }));
}

/** One size of a photo the user may see: a short-lived signed URL where the storage signs, else the bytes. */
export async function readPhotoFile(
  user: SessionUser,
  photoId: number,
  size: 'thumb' | 'screen' | 'original',
): Promise<{ redirectUrl: string } | { data: Buffer; contentType: string }> {
  const p = await Photo.findByPk(photoId);
  if (!p) throw notFound('That photo');
  await visibleTicket(user, p.workOrderId);
  const key = size === 'original' ? p.originalKey : size === 'screen' ? p.screenKey : p.thumbKey;
  const contentType = size === 'original' ? p.originalType : 'image/jpeg';
  if (storage.signedUrl) return { redirectUrl: await storage.signedUrl(key, { expiresInS: SIGNED_URL_TTL_S, contentType }) };
  return { data: await storage.get(key), contentType };
}

/** Record the thermal finding of a thermal image; the severity class comes from packages/pv. */
export async function recordThermalFinding(user: SessionUser, photoId: number, input: ThermalFindingInput): Promise<PhotoDto> {
  const p = await Photo.findByPk(photoId);
  if (!p) throw notFound('That photo');
  await ticketForEvidence(user, p.workOrderId);
  if (p.tag !== 'thermal') throw new AppError('VALIDATION_FAILED', 'Thermal findings belong to photos tagged "thermal".');
  await sequelize.transaction(async (transaction) => {
    await holdInField(p.workOrderId, transaction);
    await ThermalFinding.upsert(thermalFindingRow(photoId, input), { transaction });
  });
  return (await photoDtos([p]))[0]!;
}

/** The stored thermal finding of a photo: the reading as given, the severity class from packages/pv. */
export function thermalFindingRow(photoId: number, input: ThermalFindingInput): CreationAttributes<ThermalFinding> {
  const c = classifyThermalAnomaly({
    deltaTC: input.hottestC - input.referenceC,
    irradianceWm2: input.irradianceWm2,
    pattern: patternMap[input.pattern] ?? 'other',
    maxTempC: input.hottestC,
  });
  return {
    photoId,
    hottestC: input.hottestC,
    referenceC: input.referenceC,
    irradianceWm2: input.irradianceWm2,
    pattern: input.pattern,
    modulePosition: input.modulePosition,
    classOfAbnormality: c.classOfAbnormality,
    isConditionsTooPoor: c.isConditionsTooPoor,
    reason: c.reason.slice(0, 1000),
  };
}

/** CoA 3 thermal findings on a ticket suggest raising it to P1. */
export async function prioritySuggestion(workOrderId: number): Promise<{ priority: 'P1'; reason: string } | null> {
  const photos = await Photo.findAll({ where: { workOrderId, tag: 'thermal' }, attributes: ['id'] });
  if (photos.length === 0) return null;
  const worst = await ThermalFinding.findOne({ where: { photoId: photos.map((p) => p.id), classOfAbnormality: 3 } });
  return worst ? { priority: 'P1', reason: `A thermal finding is safety-relevant (CoA 3): ${worst.reason}` } : null;
}

// ---------- diode replacements ----------
/** What a diode-replacement record still lacks before a supervisor can accept it (also a sign-off gate). */
export function missingOf(d: DiodeReplacement): string[] {
  const missing: string[] = [];
  if (!d.moduleSerial) missing.push('module serial');
  if (d.newDiodeForwardV === null) missing.push('forward voltage of the new diode');
  if (d.vocBeforeV === null) missing.push('Voc before');
  if (d.vocAfterV === null) missing.push('Voc after');
  if (!d.beforePhotoId) missing.push('photo before');
  if (!d.afterPhotoId) missing.push('photo after');
  const removed = JSON.parse(d.removedPartJson) as Record<string, unknown>;
  if (!removed.partNumber) missing.push('removed part number');
  return missing;
}

async function diodeDtos(rows: DiodeReplacement[]): Promise<DiodeReplacementDto[]> {
  if (rows.length === 0) return [];
  const [users, strings, tickets] = await Promise.all([
    User.findAll({ where: { id: [...new Set(rows.map((r) => r.technicianId))] }, attributes: ['id', 'name'] }),
    PvString.findAll({ where: { id: [...new Set(rows.map((r) => r.stringId))] }, attributes: ['id', 'label'] }),
    WorkOrder.findAll({ where: { id: [...new Set(rows.map((r) => r.workOrderId))] }, attributes: ['id', 'number'] }),
  ]);
  const name = new Map(users.map((u) => [u.id, u.name]));
  const label = new Map(strings.map((s) => [s.id, s.label]));
  const number = new Map(tickets.map((t) => [t.id, t.number]));
  return rows.map((d) => ({
    id: d.id,
    workOrderId: d.workOrderId,
    workOrderNumber: number.get(d.workOrderId) ?? '',
    stringId: d.stringId,
    stringLabel: label.get(d.stringId) ?? '',
    modulePosition: d.modulePosition,
    moduleSerial: d.moduleSerial,
    diodePosition: d.diodePosition,
    failureMode: d.failureMode as DiodeReplacementDto['failureMode'],
    foundBy: d.foundBy as DiodeReplacementDto['foundBy'],
    removedPart: JSON.parse(d.removedPartJson) as Record<string, unknown>,
    installedPart: JSON.parse(d.installedPartJson) as Record<string, unknown>,
    newDiodeForwardV: d.newDiodeForwardV,
    vocBeforeV: d.vocBeforeV,
    vocAfterV: d.vocAfterV,
    beforePhotoId: d.beforePhotoId,
    afterPhotoId: d.afterPhotoId,
    notes: d.notes,
    technician: { id: d.technicianId, name: name.get(d.technicianId) ?? '' },
    createdAt: d.createdAt.toISOString(),
    missing: missingOf(d),
  }));
}

async function checkDiodeRefs(wo: WorkOrder, input: DiodeReplacementInput): Promise<void> {
  const onTicket = await WorkOrderString.findOne({ where: { workOrderId: wo.id, stringId: input.stringId } });
  if (!onTicket) throw new AppError('VALIDATION_FAILED', `That string is not on ${wo.number}.`, { stringId: 'Not on this ticket' });
  const s = await PvString.findByPk(input.stringId, { include: [{ association: 'moduleModel' }] });
  if (s && input.modulePosition > s.modulesInSeries) {
    throw new AppError('VALIDATION_FAILED', `${s.label} has ${s.modulesInSeries} modules.`, { modulePosition: `1 to ${s.modulesInSeries}` });
  }
  if (s?.moduleModel && input.diodePosition > s.moduleModel.bypassDiodes) {
    throw new AppError('VALIDATION_FAILED', `That module has ${s.moduleModel.bypassDiodes} bypass diodes.`, { diodePosition: `1 to ${s.moduleModel.bypassDiodes}` });
  }
  for (const [field, id] of [['beforePhotoId', input.beforePhotoId], ['afterPhotoId', input.afterPhotoId]] as const) {
    if (id === null) continue;
    const photo = await Photo.findByPk(id);
    if (!photo || photo.workOrderId !== wo.id) throw new AppError('VALIDATION_FAILED', 'Link photos of this ticket only.', { [field]: 'Not a photo of this ticket' });
  }
}

function diodeFields(input: DiodeReplacementInput) {
  return {
    stringId: input.stringId,
    modulePosition: input.modulePosition,
    moduleSerial: input.moduleSerial,
    diodePosition: input.diodePosition,
    failureMode: input.failureMode,
    foundBy: input.foundBy,
    removedPartJson: JSON.stringify(input.removedPart),
    installedPartJson: JSON.stringify(input.installedPart),
    newDiodeForwardV: input.newDiodeForwardV,
    vocBeforeV: input.vocBeforeV,
    vocAfterV: input.vocAfterV,
    beforePhotoId: input.beforePhotoId,
    afterPhotoId: input.afterPhotoId,
    notes: input.notes,
  };
}

export async function recordDiodeReplacement(user: SessionUser, workOrderId: number, input: DiodeReplacementInput): Promise<DiodeReplacementDto> {
  const wo = await ticketForEvidence(user, workOrderId);
  await checkDiodeRefs(wo, input);
  const row = await sequelize.transaction(async (transaction) => {
    await holdInField(wo.id, transaction);
    return DiodeReplacement.create({ workOrderId: wo.id, technicianId: user.id, ...diodeFields(input) }, { transaction });
  });
  return (await diodeDtos([row]))[0]!;
}

export async function updateDiodeReplacement(user: SessionUser, id: number, input: DiodeReplacementInput): Promise<DiodeReplacementDto> {
  const row = await DiodeReplacement.findByPk(id);
  if (!row) throw notFound('That diode replacement');
  const wo = await ticketForEvidence(user, row.workOrderId);
  await checkDiodeRefs(wo, diodeReplacementInputSchema.parse(input));
  await sequelize.transaction(async (transaction) => {
    await holdInField(wo.id, transaction);
    await row.update(diodeFields(input), { transaction });
  });
  return (await diodeDtos([row]))[0]!;
}

export async function listDiodeReplacements(user: SessionUser, filter: { workOrderId?: number; stringId?: number }): Promise<DiodeReplacementDto[]> {
  if (filter.workOrderId) await visibleTicket(user, filter.workOrderId);
  // A string of a site the caller cannot see is not found, as on the string's own page.
  const string = filter.stringId ? await PvString.findByPk(filter.stringId, { attributes: ['id', 'siteId'] }) : null;
  if (filter.stringId) {
    if (!string) throw notFound('That string');
    await findVisibleSite(user, string.siteId).catch(() => {
      throw notFound('That string');
    });
  }
  const where: Record<string, unknown> = { ...filter };
  if (user.role === 'owner' && !filter.workOrderId) {
    const ids = string ? [string.siteId] : ((await visibleSiteIds(user)) ?? []);
    const signed = await WorkOrder.findAll({ where: { siteId: ids, status: 'signed_off' }, attributes: ['id'] });
    where.workOrderId = signed.map((w) => w.id);
  }
  return diodeDtos(await DiodeReplacement.findAll({ where, order: [['id', 'ASC']] }));
}

export const uploadLimits = { fileSize: env.UPLOAD_MAX_MB * 1024 * 1024, files: env.UPLOAD_MAX_FILES };
