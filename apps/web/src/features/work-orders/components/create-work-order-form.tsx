import { zodResolver } from '@hookform/resolvers/zod';
import {
  createWorkOrderInputSchema,
  faultCategories,
  faultCategoryLabels,
  priorities,
  priorityLabels,
  workOrderSourceLabels,
  workOrderSources,
  type PvString,
  type WorkOrderDetail,
} from '@stringfield/shared';
import { useId, useState, type ReactNode } from 'react';
import { useFieldArray, useForm, useWatch } from 'react-hook-form';
import type { z } from 'zod';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormField, Input, Select, Textarea } from '@/components/ui/form-field';
import { Icon } from '@/components/ui/icon';
import { Skeleton } from '@/components/ui/skeleton';
import { isApiError } from '@/lib/api-client';
import { cn } from '@/lib/cn';
import { splitServerErrors } from '@/lib/form-errors';
import { useCreateWorkOrder } from '../api/create-work-order';
import { useSlaPolicy } from '../api/get-sla-policy';
import { useSiteOptions } from '../api/get-sites';
import { useTechnicians } from '../api/get-technicians';
import { useNow } from '../hooks/use-now';
import { formatDuration, formatSiteTime } from '../lib/sla';
import { StringPicker } from './string-picker';

type FormInput = z.input<typeof createWorkOrderInputSchema>;
type FormOutput = z.output<typeof createWorkOrderInputSchema>;
type StringInfo = Pick<PvString, 'id' | 'label' | 'inverterTag' | 'mpptInput'>;

const knownFields = [
  'siteId',
  'strings',
  'mode',
  'faultCategory',
  'priority',
  'title',
  'description',
  'source',
  'assigneeId',
] as const;

function Step({
  number,
  title,
  children,
  id,
}: {
  number: number;
  title: string;
  children: ReactNode;
  id?: string;
}) {
  return (
    <Card className="flex flex-col gap-5 p-4 sm:p-6">
      <h2 id={id} className="flex items-center gap-3 text-xl font-semibold">
        <span
          aria-hidden="true"
          className="readings grid size-8 shrink-0 place-items-center rounded-full bg-brand text-base font-bold text-on-brand"
        >
          {number}
        </span>
        {title}
      </h2>
      {children}
    </Card>
  );
}

/**
 * Opening tickets: site, then the faulty strings (each with what was seen), the fault, priority
 * (with the deadline it sets at this site), where it came from, and optionally who goes.
 * Several strings make one ticket, or one ticket each.
 */
export function CreateWorkOrderForm({
  initialSiteId,
  onCreated,
}: {
  initialSiteId?: number | undefined;
  onCreated: (items: WorkOrderDetail[]) => void;
}) {
  const create = useCreateWorkOrder();
  const now = useNow();
  const sites = useSiteOptions();
  const technicians = useTechnicians();
  const stringsHeadingId = useId();
  const [stringInfo, setStringInfo] = useState<ReadonlyMap<number, StringInfo>>(new Map());

  const {
    register,
    control,
    handleSubmit,
    setValue,
    setError,
    clearErrors,
    formState: { errors },
  } = useForm<FormInput, unknown, FormOutput>({
    resolver: zodResolver(createWorkOrderInputSchema),
    // Fields register as they appear (the site list after it loads), so the form's own choice of the first
    // field in error would not be the first on screen; `focusFirstError` takes them in page order.
    shouldFocusError: false,
    defaultValues: {
      siteId: initialSiteId,
      strings: [],
      mode: 'single',
      faultCategory: '' as FormInput['faultCategory'],
      priority: 'P3',
      title: '',
      description: '',
      source: 'monitoring_alert',
      assigneeId: undefined,
    },
  });
  const picked = useFieldArray({ control, name: 'strings', keyName: 'key' });
  const siteId = useWatch({ control, name: 'siteId' });
  const priority = useWatch({ control, name: 'priority' });
  const mode = useWatch({ control, name: 'mode' });
  const validSiteId =
    typeof siteId === 'number' && Number.isFinite(siteId) && siteId > 0 ? siteId : undefined;
  const site = sites.data?.find((s) => s.id === validSiteId);
  const sla = useSlaPolicy(validSiteId);
  const selectedIds = new Set(picked.fields.map((f) => f.stringId));
  const count = picked.fields.length;

  const toggle = (s: PvString, isSelected: boolean) => {
    const index = picked.fields.findIndex((f) => f.stringId === s.id);
    if (isSelected && index === -1) {
      picked.append({ stringId: s.id, symptom: '' }, { shouldFocus: false });
      setStringInfo((m) => new Map(m).set(s.id, s));
      clearErrors('strings');
    }
    if (!isSelected && index !== -1) picked.remove(index);
  };

  const focusFirstError = (_errors: unknown, event?: { target: EventTarget | null }) => {
    const form = event?.target;
    if (form instanceof HTMLFormElement) requestAnimationFrame(() => form.querySelector<HTMLElement>('[aria-invalid="true"]')?.focus());
  };

  const onSubmit = handleSubmit((values) => {
    create.mutate(values, {
      onSuccess: ({ items }) => onCreated(items),
      onError: (error) => {
        const split = splitServerErrors(error, knownFields);
        for (const [name, message] of split.fieldErrors)
          setError(name, { type: 'server', message }, { shouldFocus: true });
        // Per-string messages (`strings.2.symptom`) go beside that string's symptom as well.
        for (const [key, message] of Object.entries(isApiError(error) ? (error.fields ?? {}) : {})) {
          const m = /^strings\.(\d+)\.symptom$/.exec(key);
          if (m) setError(`strings.${Number(m[1])}.symptom`, { type: 'server', message });
        }
        if (split.formError) setError('root', { type: 'server', message: split.formError });
      },
    });
  }, focusFirstError);

  const hours = sla.data?.[priority];
  const dueAt = hours ? new Date(now + hours * 3_600_000).toISOString() : undefined;

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-6">
      <div aria-live="assertive" className="empty:hidden">
        {errors.root?.message ? <Alert tone="fail">{errors.root.message}</Alert> : null}
      </div>

      <Step number={1} title="Site">
        <FormField label="Site" error={errors.siteId?.message}>
          {sites.isPending ? (
            <Skeleton className="h-touch" />
          ) : (
            <Select
              {...register('siteId', {
                setValueAs: (v: unknown) => (v === '' || v === undefined ? undefined : Number(v)),
                onChange: () => {
                  // Strings belong to one site: a new site starts a new pick.
                  setValue('strings', []);
                  setStringInfo(new Map());
                },
              })}
            >
              <option value="">Choose a site</option>
              {(sites.data ?? []).map((s) => (
                <option key={s.id} value={s.id}>
                  {s.code} · {s.name}
                </option>
              ))}
            </Select>
          )}
        </FormField>
        {sites.isError ? <Alert tone="fail">The sites did not load: {sites.error.message}</Alert> : null}
      </Step>

      <Step number={2} title="Faulty strings" id={stringsHeadingId}>
        {validSiteId ? (
          <div className="grid gap-5 lg:grid-cols-2">
            <StringPicker
              siteId={validSiteId}
              selectedIds={selectedIds}
              onToggle={toggle}
              labelledBy={stringsHeadingId}
            />
            <div className="flex flex-col gap-3">
              <h3 className="font-semibold">
                {count === 0
                  ? 'No strings picked yet'
                  : `${count} ${count === 1 ? 'string' : 'strings'} picked`}
              </h3>
              <div aria-live="polite">
                {errors.strings?.message || errors.strings?.root?.message ? (
                  <p className="flex items-start gap-1.5 font-medium text-fail">
                    <Icon name="fail" className="mt-0.5 size-5" />
                    {errors.strings.message ?? errors.strings.root?.message}
                  </p>
                ) : null}
              </div>
              {count === 0 ? (
                <p className="text-ink-muted">
                  Tick the strings with the fault. Search narrows the list; ticks stay while you page.
                </p>
              ) : (
                <ul className="flex flex-col gap-3">
                  {picked.fields.map((field, index) => {
                    const info = stringInfo.get(field.stringId);
                    return (
                      <li key={field.key} className="rounded-control border border-line bg-surface p-3">
                        <div className="mb-2 flex items-center justify-between gap-2">
                          <span>
                            <span className="readings font-semibold">
                              {info?.label ?? `String #${field.stringId}`}
                            </span>
                            {info ? (
                              <span className="ml-2 text-sm text-ink-muted">
                                {info.inverterTag} · MPPT {info.mpptInput}
                              </span>
                            ) : null}
                          </span>
                          <Button
                            variant="ghost"
                            className="w-touch px-0"
                            onClick={() => picked.remove(index)}
                            aria-label={`Remove ${info?.label ?? 'string'}`}
                          >
                            <Icon name="close" />
                          </Button>
                        </div>
                        <FormField
                          label={`Symptom on ${info?.label ?? 'this string'}`}
                          isOptional
                          error={errors.strings?.[index]?.symptom?.message}
                        >
                          <Input
                            placeholder="e.g. 0 A at noon, Voc 412 V"
                            maxLength={500}
                            {...register(`strings.${index}.symptom`)}
                          />
                        </FormField>
                      </li>
                    );
                  })}
                </ul>
              )}
              {count > 1 ? (
                <fieldset className="flex flex-col gap-2">
                  <legend className="mb-1 font-semibold">How many tickets</legend>
                  {(
                    [
                      [
                        'single',
                        `One ticket for all ${count} strings`,
                        'One technician visit; the strings share the deadline.',
                      ],
                      [
                        'perString',
                        `One ticket per string (${count} tickets)`,
                        'Each string can go to a different technician.',
                      ],
                    ] as const
                  ).map(([value, label, hint]) => (
                    <label
                      key={value}
                      className={cn(
                        'flex min-h-touch cursor-pointer items-start gap-3 rounded-control border-2 p-3',
                        mode === value ? 'border-brand bg-brand-soft' : 'border-line bg-surface',
                      )}
                    >
                      <input
                        type="radio"
                        value={value}
                        className="mt-1 size-6 accent-brand"
                        {...register('mode')}
                      />
                      <span>
                        <span className="block font-semibold">{label}</span>
                        <span className="block text-sm text-ink-muted">{hint}</span>
                      </span>
                    </label>
                  ))}
                </fieldset>
              ) : null}
            </div>
          </div>
        ) : (
          <p className="text-ink-muted">Choose the site first; its strings are listed here.</p>
        )}
      </Step>

      <Step number={3} title="The fault">
        <FormField
          label="Title"
          hint="What a technician reads first, e.g. “Zero current on INV07 MPPT2”."
          error={errors.title?.message}
        >
          <Input maxLength={160} {...register('title')} />
        </FormField>
        <div className="grid gap-5 sm:grid-cols-2">
          <FormField label="Fault category" error={errors.faultCategory?.message}>
            <Select {...register('faultCategory')}>
              <option value="">Choose a category</option>
              {faultCategories.map((c) => (
                <option key={c} value={c}>
                  {faultCategoryLabels[c]}
                </option>
              ))}
            </Select>
          </FormField>
          <FormField label="Reported through" error={errors.source?.message}>
            <Select {...register('source')}>
              {workOrderSources.map((s) => (
                <option key={s} value={s}>
                  {workOrderSourceLabels[s]}
                </option>
              ))}
            </Select>
          </FormField>
        </div>
        <FormField
          label="Priority"
          error={errors.priority?.message}
          hint={
            site && hours && dueAt ? (
              <span aria-live="polite">
                At {site.code} a {priority} is due within {formatDuration(hours * 3_600_000)}: by{' '}
                <strong className="readings text-ink">{formatSiteTime(dueAt, site.timeZone)}</strong> site
                time if opened now.
              </span>
            ) : validSiteId && sla.isPending ? (
              'Looking up the deadline at this site…'
            ) : (
              'Choose the site to see the deadline this priority sets.'
            )
          }
        >
          <Select {...register('priority')}>
            {priorities.map((p) => (
              <option key={p} value={p}>
                {priorityLabels[p]}
                {sla.data ? ` (${formatDuration(sla.data[p] * 3_600_000)})` : ''}
              </option>
            ))}
          </Select>
        </FormField>
        <FormField
          label="Description"
          isOptional
          hint="Alarm text, readings, access notes."
          error={errors.description?.message}
        >
          <Textarea rows={4} maxLength={5000} {...register('description')} />
        </FormField>
      </Step>

      <Step number={4} title="Who goes">
        <FormField
          label="Technician"
          isOptional
          hint={
            mode === 'perString' && count > 1
              ? 'Every new ticket goes to this technician; leave empty to dispatch them one by one.'
              : 'Leave empty to dispatch later from the board.'
          }
          error={errors.assigneeId?.message}
        >
          <Select
            {...register('assigneeId', {
              setValueAs: (v: unknown) => (v === '' || v === undefined ? undefined : Number(v)),
            })}
          >
            <option value="">Not yet</option>
            {(technicians.data ?? []).map((t) => (
              <option key={t.id} value={t.id}>
                {t.name} ({t.openCount === 0 ? 'no open tickets' : `${t.openCount} open`})
              </option>
            ))}
          </Select>
        </FormField>
      </Step>

      <div className="flex flex-col-reverse gap-3 sm:flex-row sm:justify-end">
        <Button
          type="submit"
          variant="primary"
          size="lg"
          isPending={create.isPending}
          className="w-full sm:w-auto"
        >
          {create.isPending
            ? 'Opening…'
            : mode === 'perString' && count > 1
              ? `Open ${count} tickets`
              : 'Open ticket'}
        </Button>
      </div>
    </form>
  );
}
