import { zodResolver } from '@hookform/resolvers/zod';
import { instrumentInputSchema, instrumentKindLabels, instrumentKinds, type Instrument } from '@stringfield/shared';
import { useForm } from 'react-hook-form';
import { toast } from '@/lib/toast';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { FormField, Input, Select } from '@/components/ui/form-field';
import { isApiError } from '@/lib/api-client';
import { splitServerErrors } from '@/lib/form-errors';
import { useCreateInstrument } from '../api/create-instrument';
import { useUpdateInstrument } from '../api/update-instrument';

const fieldNames = ['kind', 'serial', 'model', 'calibrationDueOn'] as const;

/** Add an instrument to the register, or edit one (`instrument` given). */
export function InstrumentDialog({ isOpen, onClose, instrument }: { isOpen: boolean; onClose: () => void; instrument: Instrument | null }) {
  const create = useCreateInstrument();
  const update = useUpdateInstrument();
  const mutation = instrument ? update : create;
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm({
    resolver: zodResolver(instrumentInputSchema),
    defaultValues: instrument
      ? { kind: instrument.kind, serial: instrument.serial, model: instrument.model, calibrationDueOn: instrument.calibrationDueOn }
      : { kind: 'multimeter' as const, serial: '', model: '', calibrationDueOn: '' },
  });

  const onError = (error: unknown) => {
    if (isApiError(error) && error.status === 409) {
      setError('serial', { type: 'server', message: 'An instrument with this serial number is already in the register.' }, { shouldFocus: true });
      return;
    }
    const split = splitServerErrors(error, fieldNames);
    for (const [name, message] of split.fieldErrors) setError(name, { type: 'server', message }, { shouldFocus: true });
    if (split.formError) setError('root', { type: 'server', message: split.formError });
  };

  const onSubmit = handleSubmit((values) => {
    if (instrument) {
      update.mutate(
        { id: instrument.id, changes: values },
        {
          onSuccess: (saved) => {
            toast.success(`${saved.serial} updated`);
            onClose();
          },
          onError,
        },
      );
    } else {
      create.mutate(values, {
        onSuccess: (saved) => {
          toast.success(`${saved.serial} added to the register`);
          onClose();
        },
        onError,
      });
    }
  });

  return (
    <Dialog isOpen={isOpen} onClose={onClose} title={instrument ? `Edit ${instrument.serial}` : 'Add an instrument'} description="Checks name the instruments they were taken with; a reading taken past the calibration date is flagged.">
      <form onSubmit={(e) => void onSubmit(e)} noValidate className="flex flex-col gap-5">
        <div aria-live="assertive" className="empty:hidden">
          {errors.root?.message ? <Alert tone="fail">{errors.root.message}</Alert> : null}
        </div>
        <FormField label="Kind" error={errors.kind?.message}>
          <Select {...register('kind')}>
            {instrumentKinds.map((k) => (
              <option key={k} value={k}>
                {instrumentKindLabels[k]}
              </option>
            ))}
          </Select>
        </FormField>
        <FormField label="Serial number" error={errors.serial?.message}>
          <Input autoComplete="off" autoCapitalize="characters" spellCheck={false} className="readings" {...register('serial')} />
        </FormField>
        <FormField label="Make and model" isOptional error={errors.model?.message}>
          <Input autoComplete="off" {...register('model')} />
        </FormField>
        <FormField label="Calibration due on" hint="The date on the calibration certificate." error={errors.calibrationDueOn?.message}>
          <Input type="date" {...register('calibrationDueOn')} />
        </FormField>
        <div className="flex flex-col-reverse gap-3 sm:flex-row sm:justify-end">
          <Button variant="secondary" onClick={onClose} disabled={mutation.isPending}>
            Cancel
          </Button>
          <Button type="submit" variant="primary" isPending={mutation.isPending}>
            {instrument ? 'Save changes' : 'Add instrument'}
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
