import { zodResolver } from '@hookform/resolvers/zod';
import { thermalFindingInputSchema, thermalPatternLabels, thermalPatterns, type Photo, type ThermalFindingInput } from '@stringfield/shared';
import { useForm, useWatch } from 'react-hook-form';
import type { z } from 'zod';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { FormField, Input, Select } from '@/components/ui/form-field';
import { splitServerErrors } from '@/lib/form-errors';
import { useRecordThermalFinding } from '../api/record-thermal-finding';
import { formatNumber } from '../lib/format';
import { parseNumber } from '../lib/parse-number';
import { isIrradianceTooLow, MIN_THERMOGRAPHY_IRRADIANCE_WM2, previewDeltaT } from '../lib/thermal';
import { UnitInput } from './unit-input';

type FormValues = z.input<typeof thermalFindingInputSchema>;
const fieldNames = ['hottestC', 'referenceC', 'irradianceWm2', 'pattern', 'modulePosition'] as const;
const number = { setValueAs: parseNumber };

function defaultsOf(photo: Photo): Partial<FormValues> {
  const t = photo.thermal;
  if (!t) return { modulePosition: photo.modulePosition ?? undefined };
  return {
    hottestC: t.hottestC,
    referenceC: t.referenceC,
    irradianceWm2: t.irradianceWm2,
    pattern: (thermalPatterns as readonly string[]).includes(t.pattern) ? (t.pattern as FormValues['pattern']) : undefined,
    modulePosition: t.modulePosition ?? undefined,
  };
}

/**
 * The finding of one thermal image. ΔT and the irradiance warning show while typing; the class of
 * abnormality comes back from the server (IEC TS 62446-3) and shows beside the image.
 */
export function ThermalFindingForm({ photo, workOrderId, onSaved, onCancel }: { photo: Photo; workOrderId: number; onSaved?: (photo: Photo) => void; onCancel?: () => void }) {
  const record = useRecordThermalFinding(workOrderId);
  const {
    register,
    handleSubmit,
    setError,
    control,
    formState: { errors },
  } = useForm<FormValues, unknown, ThermalFindingInput>({ resolver: zodResolver(thermalFindingInputSchema), defaultValues: defaultsOf(photo) });
  const [hottestC, referenceC, irradianceWm2] = useWatch({ control, name: ['hottestC', 'referenceC', 'irradianceWm2'] });
  const deltaT = previewDeltaT(hottestC, referenceC);
  const isTooLow = isIrradianceTooLow(irradianceWm2);

  const onSubmit = handleSubmit((input) => {
    record.mutate(
      { photoId: photo.id, input },
      {
        onSuccess: (saved) => onSaved?.(saved),
        onError: (error) => {
          const split = splitServerErrors(error, fieldNames);
          for (const [name, message] of split.fieldErrors) setError(name, { type: 'server', message }, { shouldFocus: true });
          if (split.formError) setError('root', { type: 'server', message: split.formError });
        },
      },
    );
  });

  const id = `thermal-${photo.id}`;
  return (
    <form onSubmit={onSubmit} noValidate aria-labelledby={`${id}-title`} className="flex flex-col gap-4">
      <h4 id={`${id}-title`} className="text-lg font-semibold">
        Thermal finding
      </h4>
      <div aria-live="assertive" className="empty:hidden">
        {errors.root?.message ? <Alert tone="fail">{errors.root.message}</Alert> : null}
      </div>
      <div className="grid gap-4 sm:grid-cols-2">
        <FormField label="Hottest spot (°C)" error={errors.hottestC?.message}>
          <UnitInput unit="°C" {...register('hottestC', number)} />
        </FormField>
        <FormField label="Reference, healthy area (°C)" error={errors.referenceC?.message}>
          <UnitInput unit="°C" {...register('referenceC', number)} />
        </FormField>
        <FormField label="Irradiance in the module plane (W/m²)" error={errors.irradianceWm2?.message}>
          <UnitInput unit="W/m²" {...register('irradianceWm2', number)} />
        </FormField>
        <FormField label="Pattern" error={errors.pattern?.message}>
          <Select defaultValue="" {...register('pattern')}>
            <option value="" disabled>
              Choose…
            </option>
            {thermalPatterns.map((p) => (
              <option key={p} value={p}>
                {thermalPatternLabels[p]}
              </option>
            ))}
          </Select>
        </FormField>
        <FormField label="Module position" hint="Counted from the + end" isOptional error={errors.modulePosition?.message}>
          <Input type="text" inputMode="numeric" autoComplete="off" className="readings" {...register('modulePosition', number)} />
        </FormField>
      </div>
      <div aria-live="polite" className="flex flex-col gap-2">
        <p className="readings text-lg">
          ΔT <span className="font-bold">{deltaT === null ? '—' : `${formatNumber(deltaT)} K`}</span>
          <span className="text-base text-ink-muted"> (hottest − reference)</span>
        </p>
        {isTooLow ? (
          <Alert tone="attention" title="Conditions too poor">
            Below {MIN_THERMOGRAPHY_IRRADIANCE_WM2} W/m² a thermal image cannot be classified. Save it anyway if you must, and repeat it in steady sun with the string under load.
          </Alert>
        ) : null}
      </div>
      <div className="flex flex-col-reverse gap-3 sm:flex-row sm:justify-end">
        {onCancel ? (
          <Button variant="secondary" onClick={onCancel} disabled={record.isPending}>
            Cancel
          </Button>
        ) : null}
        <Button type="submit" variant="primary" isPending={record.isPending}>
          {photo.thermal ? 'Save the finding' : 'Classify and save'}
        </Button>
      </div>
    </form>
  );
}
