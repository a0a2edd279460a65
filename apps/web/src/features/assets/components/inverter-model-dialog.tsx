import { zodResolver } from '@hookform/resolvers/zod';
import { inverterModelInputSchema, type InverterModel, type InverterModelInput } from '@stringfield/shared';
import { useForm } from 'react-hook-form';
import { toast } from 'sonner';
import type { z } from 'zod';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { FormField, Input } from '@/components/ui/form-field';
import { splitServerErrors } from '@/lib/form-errors';
import { useCreateInverterModel } from '../api/create-inverter-model';
import { useUpdateInverterModel } from '../api/update-inverter-model';
import { parseDecimal } from '../lib/parse-decimal';
import { QuantityInput } from './quantity-input';

type FormValues = z.input<typeof inverterModelInputSchema>;
type NumberField = Exclude<keyof InverterModelInput, 'maker' | 'model'>;

const numberFields: { name: NumberField; label: string; unit: string; hint?: string }[] = [
  { name: 'maxDcV', label: 'Max DC voltage', unit: 'V' },
  { name: 'mpptMinV', label: 'MPPT minimum', unit: 'V' },
  { name: 'mpptMaxV', label: 'MPPT maximum', unit: 'V' },
  { name: 'startV', label: 'Start voltage', unit: 'V' },
  { name: 'mpptInputs', label: 'MPPT inputs', unit: 'inputs' },
  { name: 'maxInputA', label: 'Max input current', unit: 'A', hint: 'Per MPPT input' },
  { name: 'maxInputIscA', label: 'Max input short-circuit current', unit: 'A', hint: 'Per MPPT input' },
  { name: 'ratedAcW', label: 'Rated AC power', unit: 'W' },
  { name: 'maxDcW', label: 'Max DC power', unit: 'W', hint: 'Whole inverter; split over the inputs' },
];
const fieldNames = ['maker', 'model', ...numberFields.map((f) => f.name)] as const;

function defaultsOf(model: InverterModel | null): Partial<FormValues> {
  if (!model) return { maker: '', model: '' };
  const { id: _id, isArchived: _a, inverterCount: _c, ...rest } = model;
  return rest;
}

/** Adds an inverter datasheet, or corrects one. */
export function InverterModelDialog({ isOpen, model, onClose }: { isOpen: boolean; model: InverterModel | null; onClose: () => void }) {
  return (
    <Dialog
      isOpen={isOpen}
      onClose={onClose}
      title={model ? `Edit ${model.model}` : 'Add an inverter datasheet'}
      description="DC input values from the manufacturer's datasheet."
      className="w-[min(100%-1.5rem,44rem)]"
    >
      {isOpen ? <InverterModelForm key={model?.id ?? 'new'} model={model} onDone={onClose} /> : null}
    </Dialog>
  );
}

function InverterModelForm({ model, onDone }: { model: InverterModel | null; onDone: () => void }) {
  const create = useCreateInverterModel();
  const update = useUpdateInverterModel();
  const isPending = create.isPending || update.isPending;
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<FormValues, unknown, InverterModelInput>({ resolver: zodResolver(inverterModelInputSchema), defaultValues: defaultsOf(model) });

  const onError = (error: unknown) => {
    const split = splitServerErrors(error, fieldNames);
    for (const [name, message] of split.fieldErrors) setError(name, { type: 'server', message }, { shouldFocus: true });
    if (split.formError) setError('root', { type: 'server', message: split.formError });
  };
  const onSubmit = handleSubmit((input) => {
    const onSuccess = (saved: InverterModel) => {
      toast.success(model ? `${saved.model} is updated` : `${saved.model} is in the library`);
      onDone();
    };
    if (model) update.mutate({ id: model.id, input }, { onSuccess, onError });
    else create.mutate(input, { onSuccess, onError });
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      <div aria-live="assertive" className="empty:hidden">
        {errors.root?.message ? <Alert tone="fail">{errors.root.message}</Alert> : null}
      </div>
      <div className="grid gap-5 sm:grid-cols-2">
        <FormField label="Maker" error={errors.maker?.message}>
          <Input autoComplete="off" {...register('maker')} />
        </FormField>
        <FormField label="Model" error={errors.model?.message}>
          <Input autoComplete="off" spellCheck={false} {...register('model')} />
        </FormField>
      </div>
      <fieldset className="grid gap-5 sm:grid-cols-2 lg:grid-cols-3">
        <legend className="mb-2 font-semibold">DC input</legend>
        {numberFields.map((f) => (
          <FormField key={f.name} label={f.label} hint={f.hint} error={errors[f.name]?.message}>
            <QuantityInput unit={f.unit} {...register(f.name, { setValueAs: parseDecimal })} />
          </FormField>
        ))}
      </fieldset>
      <div className="flex flex-col-reverse gap-3 sm:flex-row sm:justify-end">
        <Button variant="secondary" onClick={onDone} disabled={isPending}>
          Cancel
        </Button>
        <Button type="submit" variant="primary" isPending={isPending}>
          {model ? 'Save changes' : 'Add datasheet'}
        </Button>
      </div>
    </form>
  );
}
