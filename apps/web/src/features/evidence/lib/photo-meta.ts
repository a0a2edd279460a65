import { photoMetaSchema, photoTags, type PhotoMeta } from '@stringfield/shared';
import type { PhotoTag } from './group-photos';

/** What the technician sets for one chosen file, as the form holds it (text fields are strings). */
export type PhotoDraft = { tag: PhotoTag | ''; stringId: string; modulePosition: string; caption: string };
export type PhotoDraftField = keyof PhotoDraft;
export type PhotoDraftErrors = Partial<Record<PhotoDraftField, string>>;

/** The API's limits (UPLOAD_MAX_MB, accepted formats); the server checks again. */
export const MAX_PHOTO_BYTES = 25 * 1024 * 1024;
export const ACCEPTED_PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const;
export const ACCEPT_ATTRIBUTE = ACCEPTED_PHOTO_TYPES.join(',');

/**
 * Turns one draft into the `meta` entry the upload sends, or says what to fix beside which field.
 * Blank string/module mean "not tied to one"; a module position that is not a whole number stays
 * an error instead of being dropped.
 */
export function buildPhotoMeta(draft: PhotoDraft): { ok: true; meta: PhotoMeta } | { ok: false; errors: PhotoDraftErrors } {
  const stringText = draft.stringId.trim();
  const moduleText = draft.modulePosition.trim();
  const candidate = {
    tag: (photoTags as readonly string[]).includes(draft.tag) ? draft.tag : undefined,
    stringId: stringText === '' ? null : Number(stringText),
    modulePosition: moduleText === '' ? null : /^\d+$/.test(moduleText) ? Number(moduleText) : Number.NaN,
    caption: draft.caption,
  };
  const parsed = photoMetaSchema.safeParse(candidate);
  if (parsed.success) {
    const errors: PhotoDraftErrors = {};
    if (parsed.data.modulePosition !== null && parsed.data.stringId === null) errors.stringId = 'Choose the string the module is on';
    if (Object.keys(errors).length > 0) return { ok: false, errors };
    return { ok: true, meta: parsed.data };
  }
  const errors: PhotoDraftErrors = {};
  for (const issue of parsed.error.issues) {
    const key = issue.path[0];
    if (key === 'tag' || key === 'stringId' || key === 'modulePosition' || key === 'caption') errors[key] ??= key === 'modulePosition' && Number.isNaN(candidate.modulePosition) ? 'Module position must be a whole number' : issue.message;
  }
  return { ok: false, errors };
}

function isHeic(file: Pick<File, 'name' | 'type'>): boolean {
  return /^image\/hei[cf](-sequence)?$/i.test(file.type) || /\.(heic|heif)$/i.test(file.name);
}

/**
 * Refuses, before any byte is sent, what the server would refuse anyway: HEIC (said plainly, with
 * the camera setting that fixes it), other formats and files over the size limit. null means "send it".
 */
export function fileProblem(file: Pick<File, 'name' | 'type' | 'size'>): string | null {
  const name = file.name || 'This file';
  if (isHeic(file)) {
    return `${name} is HEIC, which Stringfield cannot decode yet. Set the phone camera to "Most compatible" (JPEG) or send a JPEG.`;
  }
  if (file.type && !(ACCEPTED_PHOTO_TYPES as readonly string[]).includes(file.type)) {
    return `${name} is not a JPEG, PNG or WebP photo.`;
  }
  if (file.size > MAX_PHOTO_BYTES) return `${name} is ${formatMegabytes(file.size)}; the limit is 25 MB per photo.`;
  if (file.size === 0) return `${name} is empty.`;
  return null;
}

export function formatMegabytes(bytes: number): string {
  const mb = bytes / (1024 * 1024);
  return mb >= 10 ? `${mb.toFixed(0)} MB` : mb >= 0.1 ? `${mb.toFixed(1)} MB` : `${Math.max(1, Math.round(bytes / 1024))} kB`;
}

/** Whole percent of an upload, or null when the browser does not know the total. */
export function progressPercent(loadedBytes: number, totalBytes: number | undefined): number | null {
  if (!totalBytes) return null;
  return Math.min(100, Math.max(0, Math.round((loadedBytes / totalBytes) * 100)));
}
