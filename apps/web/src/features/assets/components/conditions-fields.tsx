import { Button } from '@/components/ui/button';
import { FormField } from '@/components/ui/form-field';
import type { ConditionsText } from '../lib/conditions';
import { QuantityInput } from './quantity-input';

export type ConditionPreset = { label: string; value: ConditionsText };

/** Irradiance in the module plane and module (back-of-module) temperature, with quick presets. */
export function ConditionsFields({
  value,
  errors,
  presets,
  onChange,
}: {
  value: ConditionsText;
  errors: Partial<Record<keyof ConditionsText, string>>;
  presets: readonly ConditionPreset[];
  onChange: (next: ConditionsText) => void;
}) {
  return (
    <fieldset className="flex flex-col gap-4">
      <legend className="mb-2 font-semibold">Operating condition</legend>
      <div className="grid gap-4">
        <FormField label="Irradiance" hint="In the module plane." error={errors.irradianceWm2}>
          <QuantityInput unit="W/m²" value={value.irradianceWm2} onChange={(e) => onChange({ ...value, irradianceWm2: e.target.value })} />
        </FormField>
        <FormField label="Module temperature" hint="Back of module, out of the wind." error={errors.moduleTempC}>
          <QuantityInput unit="°C" value={value.moduleTempC} onChange={(e) => onChange({ ...value, moduleTempC: e.target.value })} />
        </FormField>
      </div>
      <div className="flex flex-wrap gap-2" role="group" aria-label="Presets">
        {presets.map((preset) => (
          <Button key={preset.label} variant="secondary" onClick={() => onChange(preset.value)}>
            {preset.label}
          </Button>
        ))}
      </div>
    </fieldset>
  );
}
