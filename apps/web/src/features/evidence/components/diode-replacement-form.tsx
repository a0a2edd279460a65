import { zodResolver } from '@hookform/resolvers/zod';
import {
  diodeFailureModes,
  diodeFoundBy,
  diodeReplacementInputSchema,
  diodeTypes,
  photoTagLabels,
  type DiodeReplacement,
  type DiodeReplacementInput,
  type Photo,
} from '@stringfield/shared';
import { useForm } from 'react-hook-form';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { FormField, Input, Select, Textarea } from '@/components/ui/form-field';
import { splitServerErrors } from '@/lib/form-errors';
import { useSaveDiodeReplacement } from '../api/save-diode-replacement';
import { diodeFieldNames, diodeFormDefaults, diodeTypeLabels, failureModeLabels, foundByLabels, type DiodeFormValues } from '../lib/diode-form';
import type { TicketString } from '../lib/group-photos';
import { parseNumber, parseOptionalId } from '../lib/parse-number';
import { UnitInput } from './unit-input';

const number = { setValueAs: parseNumber };
/** Optional numbers the API keeps as null ("not measured yet"), which the record lists as missing. */
const optionalNumber = { setValueAs: (v: unknown) => parseNumber(v) ?? null };
const optionalText = { setValueAs: (v: unknown) => (typeof v === 'string' && v.trim() === '' ? undefined : v) };
const optionalChoice = { setValueAs: (v: unknown) => (v === '' ? undefined : v) };
const photoId = { setValueAs: parseOptionalId };

function photoOption(p: Photo): string {
  return [photoTagLabels[p.tag], p.stringLabel, p.modulePosition ? `module ${p.modulePosition}` : null, p.caption || null, `#${p.id}`].filter(Boolean).join(' · ');
}

/**
 * Records a bypass-diode replacement, or completes one (the PUT sends the whole record). The photos
 * are links to this ticket's uploads, so upload them first; what is still blank shows as missing.
 */
export function DiodeReplacementForm({
  workOrderId,
  strings,
  photos,
  record,
  onDone,
}: {
  workOrderId: number;
  strings: readonly TicketString[];
  photos: readonly Photo[];
  record: DiodeReplacement | null;
  onDone: (saved?: DiodeReplacement) => void;
}) {
  const save = useSaveDiodeReplacement(workOrderId);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<DiodeFormValues, unknown, DiodeReplacementInput>({
    resolver: zodResolver(diodeReplacementInputSchema),
    defaultValues: diodeFormDefaults(record, { stringId: strings.length === 1 ? strings[0]!.id : undefined }),
  });

  const onSubmit = handleSubmit((input) => {
    save.mutate(
      { id: record?.id, input },
      {
        onSuccess: (saved) => onDone(saved),
        onError: (error) => {
          const split = splitServerErrors(error, diodeFieldNames);
          for (const [name, message] of split.fieldErrors) setError(name, { type: 'server', message }, { shouldFocus: true });
          if (split.formError) setError('root', { type: 'server', message: split.formError });
        },
      },
    );
  });

  // Every photo of the ticket can be linked; the matching tag comes first.
  const before = [...photos.filter((p) => p.tag === 'before'), ...photos.filter((p) => p.tag !== 'before')];
  const after = [...photos.filter((p) => p.tag === 'after'), ...photos.filter((p) => p.tag !== 'after')];
  const e = errors;

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-6" aria-label={record ? 'Complete the diode replacement' : 'Record a diode replacement'}>
      <div aria-live="assertive" className="empty:hidden">
        {e.root?.message ? <Alert tone="fail">{e.root.message}</Alert> : null}
      </div>

      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 text-lg font-semibold">Where</legend>
        <FormField label="String" error={e.stringId?.message}>
          <Select defaultValue="" {...register('stringId', { setValueAs: (v: unknown) => (v === '' ? undefined : Number(v)) })}>
            <option value="" disabled>
              Choose…
            </option>
            {strings.map((s) => (
              <option key={s.id} value={s.id}>
                {s.label}
              </option>
            ))}
          </Select>
        </FormField>
        <FormField label="Module position" hint="Counted from the + end of the string" error={e.modulePosition?.message}>
          <Input type="text" inputMode="numeric" autoComplete="off" className="readings" {...register('modulePosition', number)} />
        </FormField>
        <FormField label="Module serial" hint="From the label on the back" error={e.moduleSerial?.message}>
          <Input autoComplete="off" spellCheck={false} className="readings" {...register('moduleSerial')} />
        </FormField>
        <FormField label="Diode position" hint="1 to the number of diodes in the junction box" error={e.diodePosition?.message}>
          <Input type="text" inputMode="numeric" autoComplete="off" className="readings" {...register('diodePosition', number)} />
        </FormField>
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 text-lg font-semibold">What was found</legend>
        <FormField label="Failure found" error={e.failureMode?.message}>
          <Select defaultValue="" {...register('failureMode')}>
            <option value="" disabled>
              Choose…
            </option>
            {diodeFailureModes.map((m) => (
              <option key={m} value={m}>
                {failureModeLabels[m]}
              </option>
            ))}
          </Select>
        </FormField>
        <FormField label="How it was found" error={e.foundBy?.message}>
          <Select defaultValue="" {...register('foundBy')}>
            <option value="" disabled>
              Choose…
            </option>
            {diodeFoundBy.map((m) => (
              <option key={m} value={m}>
                {foundByLabels[m]}
              </option>
            ))}
          </Select>
        </FormField>
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 text-lg font-semibold">Removed diode</legend>
        <FormField label="Part number" error={e.removedPart?.partNumber?.message}>
          <Input autoComplete="off" spellCheck={false} className="readings" {...register('removedPart.partNumber', optionalText)} />
        </FormField>
        <FormField label="Type" isOptional error={e.removedPart?.type?.message}>
          <Select {...register('removedPart.type', optionalChoice)}>
            <option value="">Not known</option>
            {diodeTypes.map((t) => (
              <option key={t} value={t}>
                {diodeTypeLabels[t]}
              </option>
            ))}
          </Select>
        </FormField>
        <FormField label="Current rating (A)" isOptional error={e.removedPart?.ratingA?.message}>
          <UnitInput unit="A" {...register('removedPart.ratingA', number)} />
        </FormField>
        <FormField label="Voltage rating (V)" isOptional error={e.removedPart?.ratingV?.message}>
          <UnitInput unit="V" {...register('removedPart.ratingV', number)} />
        </FormField>
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 text-lg font-semibold">Installed diode</legend>
        <FormField label="Part number" error={e.installedPart?.partNumber?.message}>
          <Input autoComplete="off" spellCheck={false} className="readings" {...register('installedPart.partNumber')} />
        </FormField>
        <FormField label="Type" error={e.installedPart?.type?.message}>
          <Select {...register('installedPart.type')}>
            {diodeTypes.map((t) => (
              <option key={t} value={t}>
                {diodeTypeLabels[t]}
              </option>
            ))}
          </Select>
        </FormField>
        <FormField label="Current rating (A)" error={e.installedPart?.ratingA?.message}>
          <UnitInput unit="A" {...register('installedPart.ratingA', number)} />
        </FormField>
        <FormField label="Voltage rating (V)" error={e.installedPart?.ratingV?.message}>
          <UnitInput unit="V" {...register('installedPart.ratingV', number)} />
        </FormField>
        <FormField label="Forward voltage of the new diode (V)" hint="Diode test on the meter, typically 0.3–0.7 V" error={e.newDiodeForwardV?.message}>
          <UnitInput unit="V" {...register('newDiodeForwardV', optionalNumber)} />
        </FormField>
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 text-lg font-semibold">String Voc</legend>
        <FormField label="Voc before (V)" error={e.vocBeforeV?.message}>
          <UnitInput unit="V" {...register('vocBeforeV', optionalNumber)} />
        </FormField>
        <FormField label="Voc after (V)" error={e.vocAfterV?.message}>
          <UnitInput unit="V" {...register('vocAfterV', optionalNumber)} />
        </FormField>
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 text-lg font-semibold">Photos</legend>
        <p className="text-sm text-ink-muted sm:col-span-2">Pick from this ticket&apos;s photos. Upload them first if they are not listed.</p>
        <FormField label="Photo before" error={e.beforePhotoId?.message}>
          <Select {...register('beforePhotoId', photoId)}>
            <option value="">None yet</option>
            {before.map((p) => (
              <option key={p.id} value={p.id}>
                {photoOption(p)}
              </option>
            ))}
          </Select>
        </FormField>
        <FormField label="Photo after" error={e.afterPhotoId?.message}>
          <Select {...register('afterPhotoId', photoId)}>
            <option value="">None yet</option>
            {after.map((p) => (
              <option key={p.id} value={p.id}>
                {photoOption(p)}
              </option>
            ))}
          </Select>
        </FormField>
      </fieldset>

      <FormField label="Notes" isOptional error={e.notes?.message}>
        <Textarea rows={3} maxLength={2000} {...register('notes')} />
      </FormField>

      <div className="flex flex-col-reverse gap-3 sm:flex-row sm:justify-end">
        <Button variant="secondary" onClick={() => onDone()} disabled={save.isPending}>
          Cancel
        </Button>
        <Button type="submit" variant="primary" size="lg" isPending={save.isPending}>
          {record ? 'Save the record' : 'Record the replacement'}
        </Button>
      </div>
    </form>
  );
}
