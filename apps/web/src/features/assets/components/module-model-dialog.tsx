import { zodResolver } from '@hookform/resolvers/zod';
import { cellTechnologies, moduleModelInputSchema, type ModuleModel, type ModuleModelInput } from '@stringfield/shared';
import { useForm } from 'react-hook-form';
import { toast } from 'sonner';
import type { z } from 'zod';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { FormField, Input, Select } from '@/components/ui/form-field';
import { splitServerErrors } from '@/lib/form-errors';
import { useCreateModuleModel } from '../api/create-module-model';
import { useUpdateModuleModel } from '../api/update-module-model';
import { parseDecimal } from '../lib/parse-decimal';
import { QuantityInput } from './quantity-input';

type FormValues = z.input<typeof moduleModelInputSchema>;
type NumberField = Exclude<keyof ModuleModelInput, 'maker' | 'model' | 'cellTechnology'>;

const numberFields: { name: NumberField; label: string; unit: string; hint?: string }[] = [
  { name: 'pmaxW', label: 'Pmax', unit: 'W' },
  { name: 'vocV', label: 'Voc', unit: 'V' },
  { name: 'iscA', label: 'Isc', unit: 'A' },
  { name: 'vmpV', label: 'Vmp', unit: 'V' },
  { name: 'impA', label: 'Imp', unit: 'A' },
  { name: 'alphaIscPctPerC', label: 'α Isc', unit: '%/°C', hint: 'Usually +0.03 to +0.06' },
  { name: 'betaVocPctPerC', label: 'β Voc', unit: '%/°C', hint: 'Negative, like −0.27' },
  { name: 'gammaPmaxPctPerC', label: 'γ Pmax', unit: '%/°C', hint: 'Negative, like −0.35' },
  { name: 'cellsInSeries', label: 'Cells in series', unit: 'cells', hint: 'Half-cut 144 counts 72' },
  { name: 'bypassDiodes', label: 'Bypass diodes', unit: 'diodes' },
  { name: 'noctC', label: 'NOCT', unit: '°C', hint: 'Optional, usually 42–48' },
];
const fieldNames = ['maker', 'model', 'cellTechnology', ...numberFields.map((f) => f.name)] as const;

function defaultsOf(model: ModuleModel | null): Partial<FormValues> {
  if (!model) return { maker: '', model: '', cellTechnology: 'mono-PERC' };
  const { id: _id, isArchived: _a, stringCount: _s, noctC, ...rest } = model;
  return { ...rest, noctC: noctC ?? undefined };
}

/** Adds a module datasheet, or corrects one (every string using it is re-checked). */
export function ModuleModelDialog({ isOpen, model, onClose }: { isOpen: boolean; model: ModuleModel | null; onClose: () => void }) {
  return (
    <Dialog
      isOpen={isOpen}
      onClose={onClose}
      title={model ? `Edit ${model.model}` : 'Add a module datasheet'}
      description="Values at STC from the manufacturer's datasheet. Coefficients in %/°C as printed."
      className="w-[min(100%-1.5rem,44rem)]"
    >
      {isOpen ? <ModuleModelForm key={model?.id ?? 'new'} model={model} onDone={onClose} /> : null}
    </Dialog>
  );
}

function ModuleModelForm({ model, onDone }: { model: ModuleModel | null; onDone: () => void }) {
  const create = useCreateModuleModel();
  const update = useUpdateModuleModel();
  const isPending = create.isPending || update.isPending;
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors },
  } = useForm<FormValues, unknown, ModuleModelInput>({ resolver: zodResolver(moduleModelInputSchema), defaultValues: defaultsOf(model) });

  const onError = (error: unknown) => {
    const split = splitServerErrors(error, fieldNames);
    for (const [name, message] of split.fieldErrors) setError(name, { type: 'server', message }, { shouldFocus: true });
    if (split.formError) setError('root', { type: 'server', message: split.formError });
  };
  const onSubmit = handleSubmit((input) => {
    const onSuccess = (saved: ModuleModel) => {
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
        <FormField label="Cell technology" error={errors.cellTechnology?.message}>
          <Select {...register('cellTechnology')}>
            {cellTechnologies.map((t) => (
              <option key={t} value={t}>
                {t}
              </option>
            ))}
          </Select>
        </FormField>
      </div>
      <fieldset className="grid gap-5 sm:grid-cols-2 lg:grid-cols-3">
        <legend className="mb-2 font-semibold">Electrical values</legend>
        {numberFields.map((f) => (
          <FormField key={f.name} label={f.label} hint={f.hint} isOptional={f.name === 'noctC'} error={errors[f.name]?.message}>
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
