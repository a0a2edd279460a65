import { photoTagLabels, photoTags, type PhotoMeta } from '@stringfield/shared';
import { useEffect, useId, useRef, useState, type ChangeEvent } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { FormField, Input, Select } from '@/components/ui/form-field';
import { Icon } from '@/components/ui/icon';
import { isApiError } from '@/lib/api-client';
import { cn } from '@/lib/cn';
import { useUploadPhoto } from '../api/upload-photo';
import type { TicketString } from '../lib/group-photos';
import {
  ACCEPT_ATTRIBUTE,
  buildPhotoMeta,
  fileProblem,
  formatMegabytes,
  progressPercent,
  type PhotoDraft,
  type PhotoDraftErrors,
} from '../lib/photo-meta';

type Status = 'draft' | 'uploading' | 'done' | 'failed';
type Item = {
  key: string;
  file: File;
  previewUrl: string | null;
  draft: PhotoDraft;
  errors: PhotoDraftErrors;
  /** Refused before sending (HEIC, wrong type, too large): cannot be retried, only removed. */
  refusal: string | null;
  status: Status;
  percent: number | null;
  message: string | null;
};

/* Two at a time: enough to keep a mobile link busy without starving the page. */
const PARALLEL_UPLOADS = 2;

let counter = 0;
const nextKey = () => `upload-${++counter}`;

function StatusLine({ item }: { item: Item }) {
  if (item.refusal) return null;
  if (item.status === 'uploading')
    return (
      <div className="flex flex-col gap-1">
        <progress
          className="h-3 w-full accent-brand"
          max={100}
          value={item.percent ?? undefined}
          aria-label={`Uploading ${item.file.name}`}
        />
        <p className="readings text-sm text-ink-muted">{item.percent === null ? 'Uploading…' : `Uploading… ${item.percent} %`}</p>
      </div>
    );
  if (item.status === 'done')
    return (
      <p className="flex items-center gap-1.5 font-semibold text-pass">
        <Icon name="check" /> Uploaded
      </p>
    );
  if (item.status === 'failed')
    return (
      <p className="flex items-start gap-1.5 font-medium text-fail">
        <Icon name="fail" className="mt-0.5" />
        <span className="[overflow-wrap:anywhere]">{item.message}</span>
      </p>
    );
  return null;
}

/**
 * Photos from the phone's camera or library, each with its own tag, string, module position and
 * caption, sent one request per file so each shows its own progress and a failed one can be
 * retried alone. Files the server would refuse (HEIC, too large) are refused here first, plainly.
 */
export function PhotoUploader({ workOrderId, strings, onUploaded }: { workOrderId: number; strings: readonly TicketString[]; /** After each stored photo, e.g. to refresh the sign-off checklist. */ onUploaded?: () => void }) {
  const upload = useUploadPhoto(workOrderId);
  const [items, setItems] = useState<Item[]>([]);
  const [announcement, setAnnouncement] = useState('');
  const itemsRef = useRef(items);
  useEffect(() => {
    itemsRef.current = items;
  }, [items]);
  const controllers = useRef(new Map<string, AbortController>());
  const cameraRef = useRef<HTMLInputElement>(null);
  const libraryRef = useRef<HTMLInputElement>(null);
  const id = useId();

  useEffect(() => {
    const open = controllers.current;
    return () => {
      for (const c of open.values()) c.abort();
      for (const item of itemsRef.current) if (item.previewUrl) URL.revokeObjectURL(item.previewUrl);
    };
  }, []);

  const patch = (key: string, changes: Partial<Item>) => setItems((list) => list.map((i) => (i.key === key ? { ...i, ...changes } : i)));

  const onFiles = (event: ChangeEvent<HTMLInputElement>) => {
    const files = [...(event.target.files ?? [])];
    event.target.value = '';
    if (files.length === 0) return;
    const onlyString = strings.length === 1 ? String(strings[0]!.id) : '';
    const added = files.map<Item>((file) => {
      const refusal = fileProblem(file);
      return {
        key: nextKey(),
        file,
        previewUrl: refusal ? null : URL.createObjectURL(file),
        draft: { tag: '', stringId: onlyString, modulePosition: '', caption: '' },
        errors: {},
        refusal,
        status: 'draft',
        percent: null,
        message: null,
      };
    });
    setItems((list) => [...list, ...added]);
    const refused = added.filter((i) => i.refusal).length;
    setAnnouncement(
      `${added.length - refused} ${added.length - refused === 1 ? 'photo' : 'photos'} added; set the tag of each before uploading.${refused ? ` ${refused} refused.` : ''}`,
    );
  };

  const remove = (key: string) => {
    controllers.current.get(key)?.abort();
    setItems((list) => {
      const gone = list.find((i) => i.key === key);
      if (gone?.previewUrl) URL.revokeObjectURL(gone.previewUrl);
      return list.filter((i) => i.key !== key);
    });
  };

  const sendOne = async (item: Item, meta: PhotoMeta): Promise<boolean> => {
    const controller = new AbortController();
    controllers.current.set(item.key, controller);
    patch(item.key, { status: 'uploading', percent: 0, message: null });
    try {
      await upload({
        file: item.file,
        meta,
        signal: controller.signal,
        onProgress: (p) => patch(item.key, { percent: progressPercent(p.loadedBytes, p.totalBytes) }),
      });
      patch(item.key, { status: 'done', percent: 100 });
      onUploaded?.();
      return true;
    } catch (error) {
      if (error instanceof DOMException && error.name === 'AbortError') return false;
      const message = isApiError(error) ? error.message : 'The upload did not finish. Try again.';
      patch(item.key, { status: 'failed', message });
      return false;
    } finally {
      controllers.current.delete(item.key);
    }
  };

  const send = async (keys?: string[]) => {
    const queue: Array<{ item: Item; meta: PhotoMeta }> = [];
    const errorsByKey = new Map<string, PhotoDraftErrors>();
    for (const item of itemsRef.current) {
      if (item.refusal || item.status === 'done' || item.status === 'uploading') continue;
      if (keys && !keys.includes(item.key)) continue;
      const built = buildPhotoMeta(item.draft);
      errorsByKey.set(item.key, built.ok ? {} : built.errors);
      if (built.ok) queue.push({ item, meta: built.meta });
    }
    const invalid = errorsByKey.size - queue.length;
    // Functional update: uploads already running keep patching their own rows meanwhile.
    setItems((list) => list.map((i) => (errorsByKey.has(i.key) ? { ...i, errors: errorsByKey.get(i.key)! } : i)));
    if (invalid > 0) setAnnouncement(`${invalid} ${invalid === 1 ? 'photo needs' : 'photos need'} a tag or a fix before uploading.`);
    if (queue.length === 0) return;
    setAnnouncement(`Uploading ${queue.length} ${queue.length === 1 ? 'photo' : 'photos'}…`);
    let ok = 0;
    let failed = 0;
    const worker = async () => {
      for (let job = queue.shift(); job; job = queue.shift()) {
        if (await sendOne(job.item, job.meta)) ok += 1;
        else failed += 1;
      }
    };
    await Promise.all(Array.from({ length: Math.min(PARALLEL_UPLOADS, queue.length) }, worker));
    setAnnouncement(
      failed === 0 ? `${ok} ${ok === 1 ? 'photo' : 'photos'} uploaded.` : `${ok} uploaded, ${failed} failed. Each failed photo says why and can be retried.`,
    );
  };

  const clearDone = () => {
    for (const i of itemsRef.current) if (i.status === 'done' && i.previewUrl) URL.revokeObjectURL(i.previewUrl);
    setItems((list) => list.filter((i) => i.status !== 'done'));
  };

  const waiting = items.filter((i) => !i.refusal && (i.status === 'draft' || i.status === 'failed')).length;
  const isUploading = items.some((i) => i.status === 'uploading');
  const doneCount = items.filter((i) => i.status === 'done').length;

  return (
    <div className="flex flex-col gap-4" id={`${id}-uploader`}>
      <div className="grid gap-3 sm:grid-cols-2">
        <input
          ref={cameraRef}
          id={`${id}-camera`}
          type="file"
          accept={ACCEPT_ATTRIBUTE}
          capture="environment"
          multiple
          className="sr-only"
          tabIndex={-1}
          aria-hidden="true"
          onChange={onFiles}
        />
        <input
          ref={libraryRef}
          id={`${id}-library`}
          type="file"
          accept={ACCEPT_ATTRIBUTE}
          multiple
          className="sr-only"
          tabIndex={-1}
          aria-hidden="true"
          onChange={onFiles}
        />
        <Button variant="brand" size="lg" onClick={() => cameraRef.current?.click()}>
          <Icon name="plus" /> Take photos
        </Button>
        <Button variant="secondary" size="lg" onClick={() => libraryRef.current?.click()}>
          <Icon name="file" /> Choose from library
        </Button>
      </div>
      <p className="text-sm text-ink-muted">JPEG, PNG or WebP, up to 25 MB each. iPhones: set Camera › Formats to “Most compatible” so photos are JPEG.</p>

      <p aria-live="polite" role="status" className="sr-only">
        {announcement}
      </p>

      {items.length > 0 ? (
        <ul className="flex flex-col gap-3" aria-label="Photos to upload">
          {items.map((item, n) => (
            <li
              key={item.key}
              className={cn(
                'flex flex-col gap-3 rounded-card border-2 bg-surface p-3',
                item.refusal || item.status === 'failed' ? 'border-fail/50' : item.status === 'done' ? 'border-pass/40' : 'border-line',
              )}
            >
              <div className="flex items-start gap-3">
                {item.previewUrl ? (
                  <img
                    src={item.previewUrl}
                    alt=""
                    className="size-20 shrink-0 rounded-control bg-sunken object-cover"
                    // A file the browser cannot draw either gets a plain tile, not a broken-image icon.
                    onError={(e) => (e.currentTarget.style.visibility = 'hidden')}
                  />
                ) : (
                  <span className="grid size-20 shrink-0 place-items-center rounded-control bg-fail-soft text-fail">
                    <Icon name="fail" className="size-8" />
                  </span>
                )}
                <div className="min-w-0 flex-1">
                  <p className="font-semibold [overflow-wrap:anywhere]">
                    <span className="sr-only">Photo {n + 1}: </span>
                    {item.file.name || 'Photo'}
                  </p>
                  <p className="readings text-sm text-ink-muted">{formatMegabytes(item.file.size)}</p>
                </div>
                {item.status !== 'uploading' ? (
                  <Button variant="ghost" className="w-touch shrink-0 px-0" onClick={() => remove(item.key)} aria-label={`Remove ${item.file.name || 'this photo'}`}>
                    <Icon name="close" />
                  </Button>
                ) : null}
              </div>

              {item.refusal ? (
                <Alert tone="fail" title="Not sent">
                  {item.refusal}
                </Alert>
              ) : item.status === 'done' ? null : (
                <fieldset disabled={item.status === 'uploading'} className="grid gap-3 sm:grid-cols-2">
                  <legend className="sr-only">Details of {item.file.name || `photo ${n + 1}`}</legend>
                  <FormField label="Tag" error={item.errors.tag}>
                    <Select value={item.draft.tag} onChange={(e) => patch(item.key, { draft: { ...item.draft, tag: e.target.value as PhotoDraft['tag'] } })}>
                      <option value="" disabled>
                        Choose…
                      </option>
                      {photoTags.map((t) => (
                        <option key={t} value={t}>
                          {photoTagLabels[t]}
                        </option>
                      ))}
                    </Select>
                  </FormField>
                  <FormField label="String" error={item.errors.stringId}>
                    <Select value={item.draft.stringId} onChange={(e) => patch(item.key, { draft: { ...item.draft, stringId: e.target.value } })}>
                      <option value="">Not tied to a string</option>
                      {strings.map((s) => (
                        <option key={s.id} value={String(s.id)}>
                          {s.label}
                        </option>
                      ))}
                    </Select>
                  </FormField>
                  <FormField label="Module position" hint="From the + end" isOptional error={item.errors.modulePosition}>
                    <Input
                      type="text"
                      inputMode="numeric"
                      autoComplete="off"
                      className="readings"
                      value={item.draft.modulePosition}
                      onChange={(e) => patch(item.key, { draft: { ...item.draft, modulePosition: e.target.value } })}
                    />
                  </FormField>
                  <FormField label="Caption" isOptional error={item.errors.caption}>
                    <Input value={item.draft.caption} maxLength={300} onChange={(e) => patch(item.key, { draft: { ...item.draft, caption: e.target.value } })} />
                  </FormField>
                </fieldset>
              )}

              <StatusLine item={item} />
              {item.status === 'failed' ? (
                <Button variant="secondary" className="self-start" onClick={() => void send([item.key])}>
                  <Icon name="refresh" /> Retry
                </Button>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}

      {waiting > 0 || isUploading || doneCount > 0 ? (
        <div className="flex flex-col gap-3 sm:flex-row sm:items-center">
          {waiting > 0 || isUploading ? (
            <Button variant="primary" size="lg" onClick={() => void send()} isPending={isUploading} disabled={isUploading || waiting === 0}>
              {isUploading ? 'Uploading…' : <><Icon name="send" /> Upload {waiting} {waiting === 1 ? 'photo' : 'photos'}</>}
            </Button>
          ) : null}
          {doneCount > 0 && !isUploading ? (
            <Button variant="ghost" onClick={clearDone}>
              Clear {doneCount} uploaded
            </Button>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
