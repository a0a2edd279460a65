import type { ComponentProps, ReactNode } from 'react';
import { FieldError, FormField, Input } from '@/components/ui/form-field';
import { cn } from '@/lib/cn';

/**
 * A measured value: a text input with the phone's decimal keypad and the unit beside it. Text, not
 * type="number", so a decimal comma and a leading minus survive and the value is parsed once, by us.
 */
export function ReadingField({
  label,
  unit,
  error,
  hint,
  isOptional,
  className,
  after,
  ...inputProps
}: Omit<ComponentProps<'input'>, 'type'> & {
  label: ReactNode;
  unit: string;
  error?: string | undefined;
  hint?: ReactNode;
  isOptional?: boolean;
  after?: ReactNode;
}) {
  return (
    <FormField label={label} error={error} hint={hint} isOptional={isOptional} className={className}>
      <div className="flex items-stretch gap-2">
        <div className="relative min-w-0 flex-1">
          <Input
            type="text"
            inputMode="decimal"
            autoComplete="off"
            autoCorrect="off"
            spellCheck={false}
            enterKeyHint="next"
            className="readings pr-16 text-lg font-semibold"
            {...inputProps}
          />
          <span aria-hidden="true" className="pointer-events-none absolute top-1/2 right-3 -translate-y-1/2 font-semibold text-ink-muted">
            {unit}
          </span>
        </div>
        {after}
      </div>
    </FormField>
  );
}

/** Large radio choices as one row of buttons, for gloved fingers (each ≥ 48 px high). */
export function ChoiceGroup<V extends string | boolean>({
  legend,
  name,
  value,
  options,
  onChange,
  error,
  isLarge = false,
}: {
  legend: ReactNode;
  name: string;
  value: V | undefined;
  options: ReadonlyArray<{ value: V; label: ReactNode; tone?: 'pass' | 'fail' | 'neutral' }>;
  onChange: (value: V) => void;
  error?: string | undefined;
  isLarge?: boolean;
}) {
  const errorId = `${name}-error`;
  return (
    <fieldset aria-describedby={error ? errorId : undefined} className="flex min-w-0 flex-col gap-1.5">
      <legend className="mb-1.5 font-semibold text-ink">{legend}</legend>
      <div className="grid grid-cols-2 gap-2">
        {options.map((option) => {
          const isChecked = value === option.value;
          const tone = option.tone ?? 'neutral';
          return (
            <label
              key={String(option.value)}
              className={cn(
                'flex cursor-pointer items-center justify-center gap-2 rounded-control border-2 px-3 text-center font-semibold',
                'has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-focus',
                isLarge ? 'min-h-16 text-lg' : 'min-h-touch',
                !isChecked && !error && 'border-edge bg-surface text-ink hover:bg-sunken',
                // Unanswered and required: the same red edge and tint as a text field in error.
                !isChecked && error && 'border-fail bg-fail-soft/40 text-ink hover:bg-sunken',
                isChecked && tone === 'neutral' && 'border-brand bg-brand text-on-brand',
                isChecked && tone === 'pass' && 'border-pass bg-pass text-white',
                isChecked && tone === 'fail' && 'border-fail bg-fail text-white',
              )}
            >
              <input
                type="radio"
                name={name}
                className="sr-only"
                checked={isChecked}
                onChange={() => onChange(option.value)}
              />
              {option.label}
            </label>
          );
        })}
      </div>
      <div aria-live="polite">
        {error ? <FieldError id={errorId} message={error} /> : null}
      </div>
    </fieldset>
  );
}
