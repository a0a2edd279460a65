import { zodResolver } from '@hookform/resolvers/zod';
import { inverterModelInputSchema, type InverterModel, type InverterModelInput } from '@stringfield/shared';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { useCreateInverterModel } from '../api/create-inverter-model';
import { useUpdateInverterModel } from '../api/update-inverter-model';
import { DatasheetDialog, DatasheetForm, type DatasheetNumberField } from './datasheet-form';

type FormValues = z.input<typeof inverterModelInputSchema>;
type NumberField = Exclude<keyof InverterModelInput, 'maker' | 'model'>;

const numberFields: DatasheetNumberField<NumberField>[] = [
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
    <DatasheetDialog isOpen={isOpen} onClose={onClose} title={model ? `Edit ${model.model}` : 'Add an inverter datasheet'} description="DC input values from the manufacturer's datasheet.">
      <InverterModelForm key={model?.id ?? 'new'} model={model} onDone={onClose} />
    </DatasheetDialog>
  );
}

function InverterModelForm({ model, onDone }: { model: InverterModel | null; onDone: () => void }) {
  const create = useCreateInverterModel();
  const update = useUpdateInverterModel();
  const form = useForm<FormValues, unknown, InverterModelInput>({ resolver: zodResolver(inverterModelInputSchema), defaultValues: defaultsOf(model) });
  return (
    <DatasheetForm
      form={form}
      model={model}
      create={create}
      update={update}
      fieldNames={fieldNames}
      numberFields={numberFields}
      legend="DC input"
      onDone={onDone}
    />
  );
}
