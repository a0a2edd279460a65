import { zodResolver } from '@hookform/resolvers/zod';
import {
  insulationTestVoltages,
  instrumentKindLabels,
  irradianceMethodLabels,
  irradianceMethods,
  moduleTempMethodLabels,
  moduleTempMethods,
  stringCheckInputSchema,
  type Instrument,
  type StringCheck,
  type StringCheckInput,
} from '@stringfield/shared';
import { useMemo, useState } from 'react';
import { Controller, useForm, useWatch, type FieldPath } from 'react-hook-form';
import { Link } from 'react-router';
import { toast } from '@/lib/toast';
import type { z } from 'zod';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/dialog';
import { FormField, Select, Textarea } from '@/components/ui/form-field';
import { Icon } from '@/components/ui/icon';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { cn } from '@/lib/cn';
import { splitServerErrors } from '@/lib/form-errors';
import { useInstruments } from '../api/get-instruments';
import { useCheckQueue } from '../hooks/use-check-queue';
import { calibrationLabel, calibrationStatus, overdueInstruments } from '../lib/calibration';
import { markForeground, type QueuedCheck } from '../lib/check-queue';
import { emptyToUndefined, parseDecimal, parseOptionalInt, type CheckFormValues, type Conditions } from '../lib/check-values';
import { toCheckPayload } from '../lib/check-values';
import { formatTakenAt, localDay } from '../lib/format';
import { previewCheck } from '../lib/preview';
import type { StringSpec } from '../lib/string-spec';
import { LivePreview } from './live-preview';
import { ChoiceGroup, ReadingField } from './reading-inputs';

type FormInput = z.input<typeof stringCheckInputSchema>;

const formFields = [
  'phase',
  'vocV',
  'iscA',
  'operatingCurrentA',
  'operatingVoltageV',
  'irradianceWm2',
  'irradianceMethod',
  'moduleTempC',
  'moduleTempMethod',
  'ambientC',
  'polarityCorrect',
  'insulationPlusMOhm',
  'insulationMinusMOhm',
  'insulationTestVoltageV',
  'instrumentIds',
  'notes',
  'takenAt',
  'stringId',
] as const satisfies ReadonlyArray<FieldPath<FormInput>>;

export type SaveOutcome = { kind: 'saved'; check: StringCheck } | { kind: 'queued'; reason: string } | { kind: 'held'; reason: string };

function Section({ title, children, description }: { title: string; description?: string; children: React.ReactNode }) {
  return (
    <fieldset className="flex min-w-0 flex-col gap-4 rounded-card border border-line bg-surface p-4">
      <legend className="px-1 text-lg font-bold">{title}</legend>
      {description ? <p className="-mt-2 text-sm text-ink-muted">{description}</p> : null}
      {children}
    </fieldset>
  );
}

/**
 * One string reading as the technician enters it, validated by the same schema as the API. Saving
 * always goes through the queue on the phone first, so a dropped connection loses nothing; the
 * browser's preview updates with every digit.
 */
export function CheckForm({
  spec,
  ticket,
  userId,
  defaultValues,
  correcting,
  previous,
  onDone,
  onCancel,
}: {
  spec: StringSpec;
  ticket: { id: number; number: string };
  userId: number;
  defaultValues: CheckFormValues;
  /** The saved check this form corrects, if any. */
  correcting?: StringCheck | undefined;
  previous: { conditions: Conditions; takenAt: string } | null;
  onDone: (outcome: SaveOutcome) => void;
  onCancel: () => void;
}) {
  const { queue } = useCheckQueue(userId);
  const instruments = useInstruments();
  const [formError, setFormError] = useState<string | null>(null);
  const form = useForm<FormInput, unknown, StringCheckInput>({
    resolver: zodResolver(stringCheckInputSchema),
    defaultValues: defaultValues as FormInput,
    mode: 'onTouched',
  });
  const {
    register,
    control,
    handleSubmit,
    setValue,
    setError,
    formState: { errors, isSubmitting, isDirty },
  } = form;
  const [isDiscarding, setIsDiscarding] = useState(false);
  const values = useWatch({ control }) as Partial<CheckFormValues>;
  const today = localDay();
  const instrumentList = useMemo(() => instruments.data ?? [], [instruments.data]);
  const preview = useMemo(() => previewCheck(spec, values, instrumentList, today), [spec, values, instrumentList, today]);
  const overdue = overdueInstruments(instrumentList, values.instrumentIds ?? [], today);
  const isCorrection = correcting !== undefined;

  const copyConditions = () => {
    if (!previous) return;
    const c = previous.conditions;
    const opts = { shouldDirty: true, shouldValidate: true } as const;
    setValue('irradianceWm2', c.irradianceWm2, opts);
    setValue('irradianceMethod', c.irradianceMethod, opts);
    setValue('moduleTempC', c.moduleTempC, opts);
    setValue('moduleTempMethod', c.moduleTempMethod, opts);
    setValue('ambientC', c.ambientC, opts);
    toast.success('Conditions copied from your previous check', { description: `Taken at ${formatTakenAt(previous.takenAt)}. Check they still hold.` });
  };

  const flipVocSign = () => {
    const current = values.vocV;
    if (current === undefined || !Number.isFinite(current) || current === 0) return;
    setValue('vocV', -current, { shouldDirty: true, shouldValidate: true });
  };

  const onValid = async (input: StringCheckInput) => {
    setFormError(null);
    const payload = toCheckPayload(input, { isCorrection, now: new Date() });
    const item: QueuedCheck = {
      kind: isCorrection ? 'revision' : 'check',
      workOrderId: ticket.id,
      workOrderNumber: ticket.number,
      stringLabel: spec.label,
      ...(correcting ? { correctsCheckId: correcting.id } : {}),
      input: payload,
      previewVerdict: preview?.verdict ?? null,
    };
    markForeground(payload.clientId, true);
    const outcome = await queue.submit(payload.clientId, item).finally(() => markForeground(payload.clientId, false));
    if (outcome.kind === 'sent') {
      onDone({ kind: 'saved', check: outcome.result });
      return;
    }
    if (outcome.kind === 'held' && outcome.status === 400) {
      // The server refused the content: the form still has it, so take it back out of the queue and show why.
      await queue.discard(payload.clientId);
      const { fieldErrors, formError: message } = splitServerErrors(outcome.error, formFields);
      for (const [name, text] of fieldErrors) setError(name, { type: 'server', message: text }, { shouldFocus: true });
      setFormError(message ?? null);
      return;
    }
    if (outcome.kind === 'held') {
      onDone({ kind: 'held', reason: outcome.reason });
      return;
    }
    onDone({ kind: 'queued', reason: outcome.reason });
  };

  const onInvalid = () => setFormError('Some readings need a look: see the messages beside the fields.');

  const polarity = values.polarityCorrect;
  const hasNegativeVoc = values.vocV !== undefined && Number.isFinite(values.vocV) && values.vocV < 0;

  return (
    <form onSubmit={(event) => void handleSubmit(onValid, onInvalid)(event)} noValidate className="flex flex-col gap-5" aria-labelledby="check-form-title">
      <div>
        <h2 id="check-form-title" className="text-xl font-bold">
          {isCorrection ? `Correct the reading of ${spec.label}` : `New check of ${spec.label}`}
        </h2>
        {isCorrection ? (
          <p className="text-ink-muted">
            The reading of {formatTakenAt(correcting.takenAt)} stays in the history, greyed, and this one replaces it.
          </p>
        ) : null}
      </div>

      <Controller
        control={control}
        name="phase"
        render={({ field, fieldState }) => (
          <ChoiceGroup
            legend="When"
            name="phase"
            value={field.value}
            onChange={field.onChange}
            error={fieldState.error?.message}
            options={[
              { value: 'before', label: 'Before repair' },
              { value: 'after', label: 'After repair' },
            ]}
          />
        )}
      />

      <Section title="Conditions" description="Plane-of-array irradiance and back-of-module temperature, taken at the same time as the string.">
        {previous ? (
          <Button variant="secondary" onClick={copyConditions} isFullWidth>
            <Icon name="refresh" />
            Copy irradiance and temperature from my previous check ({formatTakenAt(previous.takenAt)})
          </Button>
        ) : null}
        <div className="grid gap-4 sm:grid-cols-2">
          <ReadingField label="Irradiance" unit="W/m²" isOptional error={errors.irradianceWm2?.message} {...register('irradianceWm2', { setValueAs: parseDecimal })} />
          <FormField label="Irradiance measured with" hint="Needed with an irradiance reading." error={errors.irradianceMethod?.message}>
            <Select {...register('irradianceMethod', { setValueAs: emptyToUndefined })}>
              <option value="">Choose…</option>
              {irradianceMethods.map((m) => (
                <option key={m} value={m}>
                  {irradianceMethodLabels[m]}
                </option>
              ))}
            </Select>
          </FormField>
          <ReadingField label="Module temperature" unit="°C" isOptional error={errors.moduleTempC?.message} {...register('moduleTempC', { setValueAs: parseDecimal })} />
          <FormField label="Module temperature taken" hint="Needed with a module temperature." error={errors.moduleTempMethod?.message}>
            <Select {...register('moduleTempMethod', { setValueAs: emptyToUndefined })}>
              <option value="">Choose…</option>
              {moduleTempMethods.map((m) => (
                <option key={m} value={m}>
                  {moduleTempMethodLabels[m]}
                </option>
              ))}
            </Select>
          </FormField>
          <ReadingField label="Ambient temperature" unit="°C" isOptional error={errors.ambientC?.message} {...register('ambientC', { setValueAs: parseDecimal })} />
        </div>
      </Section>

      <Section title="Readings">
        <div className="grid gap-4 sm:grid-cols-2">
          <ReadingField
            label="Voc, open-circuit voltage"
            unit="V"
            hint="Negative if the meter shows minus."
            error={errors.vocV?.message}
            {...register('vocV', { setValueAs: parseDecimal })}
            after={
              <Button variant="secondary" className="w-touch shrink-0 px-0 text-xl" onClick={flipVocSign} aria-label="Change the sign of Voc (plus or minus)">
                ±
              </Button>
            }
          />
          <ReadingField label="Isc, short-circuit current" unit="A" isOptional error={errors.iscA?.message} {...register('iscA', { setValueAs: parseDecimal })} />
          <ReadingField label="Operating current" unit="A" isOptional error={errors.operatingCurrentA?.message} {...register('operatingCurrentA', { setValueAs: parseDecimal })} />
          <ReadingField label="Operating voltage" unit="V" isOptional error={errors.operatingVoltageV?.message} {...register('operatingVoltageV', { setValueAs: parseDecimal })} />
        </div>
      </Section>

      <LivePreview preview={preview} vocV={values.vocV} iscA={values.iscA} moduleName={spec.moduleName} modulesInSeries={spec.modulesInSeries} />

      <Controller
        control={control}
        name="polarityCorrect"
        render={({ field, fieldState }) => (
          <ChoiceGroup
            legend="Polarity correct?"
            name="polarityCorrect"
            value={field.value}
            onChange={field.onChange}
            error={fieldState.error?.message}
            isLarge
            options={[
              { value: true, label: <><Icon name="check" className="size-6" /> Yes, correct</>, tone: 'pass' },
              { value: false, label: <><Icon name="fail" className="size-6" /> No, reversed</>, tone: 'fail' },
            ]}
          />
        )}
      />
      {polarity === false || hasNegativeVoc ? (
        <Alert tone="fail" title="Stop: reversed polarity">
          Do not connect the string or close its fuse or switch. Check the meter leads first, then have the plus and minus conductors swapped before anything is reconnected.
        </Alert>
      ) : null}

      <Section title="Insulation to earth" description="Leave empty if not tested today.">
        <div className="grid gap-4 sm:grid-cols-3">
          <ReadingField label="Plus to earth" unit="MΩ" isOptional error={errors.insulationPlusMOhm?.message} {...register('insulationPlusMOhm', { setValueAs: parseDecimal })} />
          <ReadingField label="Minus to earth" unit="MΩ" isOptional error={errors.insulationMinusMOhm?.message} {...register('insulationMinusMOhm', { setValueAs: parseDecimal })} />
          <FormField label="Test voltage" hint="Needed with an insulation reading." error={errors.insulationTestVoltageV?.message}>
            <Select {...register('insulationTestVoltageV', { setValueAs: parseOptionalInt })}>
              <option value="">Choose…</option>
              {insulationTestVoltages.map((v) => (
                <option key={v} value={v}>
                  {v} V
                </option>
              ))}
            </Select>
          </FormField>
        </div>
      </Section>

      <Controller
        control={control}
        name="instrumentIds"
        render={({ field }) => (
          <InstrumentPicker
            instruments={instrumentList}
            isLoading={instruments.isPending}
            loadError={instruments.isError && !instruments.data ? instruments.error : null}
            selected={field.value ?? []}
            onChange={field.onChange}
            today={today}
          />
        )}
      />
      {overdue.length > 0 ? (
        <Alert tone="attention" title={overdue.length === 1 ? 'An instrument is past calibration' : 'Instruments are past calibration'}>
          {overdue.map((i) => `${i.serial} was due on ${i.calibrationDueOn}`).join('; ')}. The reading will be saved but flagged.
        </Alert>
      ) : null}

      <FormField label="Notes" isOptional error={errors.notes?.message}>
        <Textarea rows={3} {...register('notes')} />
      </FormField>

      <div aria-live="assertive">{formError ? <Alert tone="fail">{formError}</Alert> : null}</div>

      {/* One row on a phone, so the bar above the tab bar keeps most of the screen for the readings. */}
      <div className="sticky bottom-20 z-10 -mx-4 flex gap-2 border-t-2 border-line bg-paper/95 px-4 py-2 backdrop-blur sm:static sm:mx-0 sm:border-0 sm:bg-transparent sm:p-0 lg:bottom-0">
        <Button type="submit" variant="primary" size="lg" isPending={isSubmitting} className="flex-1">
          {isSubmitting ? 'Saving…' : isCorrection ? 'Save the correction' : 'Save check'}
        </Button>
        <Button variant="secondary" size="lg" onClick={() => (isDirty ? setIsDiscarding(true) : onCancel())} disabled={isSubmitting} className="px-4">
          Cancel
        </Button>
      </div>
      <ConfirmDialog
        isOpen={isDiscarding}
        onClose={() => setIsDiscarding(false)}
        onConfirm={onCancel}
        title={isCorrection ? 'Discard the correction?' : 'Discard these readings?'}
        description="What you typed in this form is not saved anywhere."
        confirmLabel={isCorrection ? 'Discard the correction' : 'Discard the readings'}
      />
    </form>
  );
}

function InstrumentPicker({
  instruments,
  isLoading,
  loadError,
  selected,
  onChange,
  today,
}: {
  instruments: readonly Instrument[];
  isLoading: boolean;
  loadError: unknown;
  selected: readonly number[];
  onChange: (ids: number[]) => void;
  today: string;
}) {
  const toggle = (id: number) => onChange(selected.includes(id) ? selected.filter((x) => x !== id) : [...selected, id]);
  return (
    <fieldset className="flex min-w-0 flex-col gap-2 rounded-card border border-line bg-surface p-4">
      <legend className="px-1 text-lg font-bold">
        Instruments <span className="text-base font-normal text-ink-faint">(optional)</span>
      </legend>
      {isLoading ? <p className="text-ink-muted">Loading the instrument register…</p> : null}
      {loadError ? <p className="text-ink-muted">{isApiError(loadError) ? loadError.message : 'The instrument register did not load.'}</p> : null}
      {!isLoading && !loadError && instruments.length === 0 ? (
        <p className="text-ink-muted">
          No instruments in the register yet.{' '}
          <Link to={paths.instruments()} className="font-semibold text-brand underline underline-offset-4">
            Add them on the Instruments page
          </Link>
          .
        </p>
      ) : null}
      <ul className="flex flex-col gap-2">
        {instruments.map((i) => {
          const status = calibrationStatus(i, today);
          const isChecked = selected.includes(i.id);
          return (
            <li key={i.id}>
              <label
                className={cn(
                  'flex min-h-touch cursor-pointer items-center gap-3 rounded-control border-2 px-3 py-2',
                  'has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-focus',
                  isChecked ? 'border-brand bg-brand-soft' : 'border-edge bg-surface hover:bg-sunken',
                )}
              >
                <input type="checkbox" checked={isChecked} onChange={() => toggle(i.id)} className="size-6 shrink-0 accent-brand" />
                <span className="min-w-0 flex-1">
                  <span className="block font-semibold break-words">
                    {instrumentKindLabels[i.kind]} · <span className="readings">{i.serial}</span>
                  </span>
                  {i.model ? <span className="block text-sm text-ink-muted">{i.model}</span> : null}
                  {status.kind !== 'ok' ? (
                    <span className={cn('mt-1 flex items-start gap-1 text-sm font-semibold', status.kind === 'overdue' ? 'text-fail' : 'text-attention')}>
                      <Icon name={status.kind === 'overdue' ? 'fail' : 'alert'} className="mt-0.5 size-4" />
                      {calibrationLabel(status, i.calibrationDueOn)}
                    </span>
                  ) : null}
                </span>
              </label>
            </li>
          );
        })}
      </ul>
    </fieldset>
  );
}
