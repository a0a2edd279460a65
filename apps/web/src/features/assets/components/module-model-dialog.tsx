import { zodResolver } from '@hookform/resolvers/zod';
import { cellTechnologies, moduleModelInputSchema, type ModuleModel, type ModuleModelInput } from '@stringfield/shared';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { FormField, Select } from '@/components/ui/form-field';
import { useCreateModuleModel } from '../api/create-module-model';
import { useUpdateModuleModel } from '../api/update-module-model';
import { DatasheetDialog, DatasheetForm, type DatasheetNumberField } from './datasheet-form';

type FormValues = z.input<typeof moduleModelInputSchema>;
type NumberField = Exclude<keyof ModuleModelInput, 'maker' | 'model' | 'cellTechnology'>;

const numberFields: DatasheetNumberField<NumberField>[] = [
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
  { name: 'noctC', label: 'NOCT', unit: '°C', hint: 'Optional, usually 42–48', isOptional: true },
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
    <DatasheetDialog
      isOpen={isOpen}
      onClose={onClose}
      title={model ? `Edit ${model.model}` : 'Add a module datasheet'}
      description="Values at STC from the manufacturer's datasheet. Coefficients in %/°C as printed."
    >
      <ModuleModelForm key={model?.id ?? 'new'} model={model} onDone={onClose} />
    </DatasheetDialog>
  );
}

function ModuleModelForm({ model, onDone }: { model: ModuleModel | null; onDone: () => void }) {
  const create = useCreateModuleModel();
  const update = useUpdateModuleModel();
  const form = useForm<FormValues, unknown, ModuleModelInput>({ resolver: zodResolver(moduleModelInputSchema), defaultValues: defaultsOf(model) });
  const {
    register,
    formState: { errors },
  } = form;
  return (
    <DatasheetForm
      form={form}
      model={model}
      create={create}
      update={update}
      fieldNames={fieldNames}
      numberFields={numberFields}
      legend="Electrical values"
      identityExtra={
        <FormField label="Cell technology" error={errors.cellTechnology?.message}>
          <Select {...register('cellTechnology')}>
            {cellTechnologies.map((t) => (
              <option key={t} value={t}>
                {t}
              </option>
            ))}
          </Select>
        </FormField>
      }
      onDone={onDone}
    />
  );
}
