import { useId, useState } from 'react';
import { Button } from '@/components/ui/button';
import { FormField, Input } from '@/components/ui/form-field';
import { periodLabel, periodPresets, periodRange, type Period } from '../lib/period';

/**
 * Presets as one press each, or two dates. The dates apply on "Apply" (not on every keystroke, so a
 * half-typed year never fires a query); a back-to-front range is refused with a message in words.
 */
export function PeriodPicker({ value, onChange }: { value: Period; onChange: (period: Period) => void }) {
  const range = periodRange(value);
  const [from, setFrom] = useState(range.from);
  const [to, setTo] = useState(range.to);
  const [error, setError] = useState<string | undefined>();
  const headingId = useId();

  const apply = () => {
    if (!from || !to) return setError('Enter both dates');
    if (from > to) return setError('"To" must not be before "from"');
    setError(undefined);
    onChange({ preset: null, from, to });
  };

  const choosePreset = (period: Period) => {
    const r = periodRange(period);
    setFrom(r.from);
    setTo(r.to);
    setError(undefined);
    onChange(period);
  };

  return (
    <fieldset aria-labelledby={headingId} className="flex flex-col gap-3">
      <legend id={headingId} className="font-semibold text-ink">
        Period <span className="font-normal text-ink-muted">· {periodLabel(value)}</span>
      </legend>
      <div className="flex flex-wrap gap-2">
        {periodPresets.map((p) => (
          <Button
            key={p.id}
            aria-pressed={value.preset === p.id}
            variant={value.preset === p.id ? 'brand' : 'secondary'}
            onClick={() => choosePreset({ preset: p.id })}
          >
            {p.label}
          </Button>
        ))}
      </div>
      <form
        className="flex flex-wrap items-end gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          apply();
        }}
      >
        <FormField label="From" className="w-40" error={error && from > to ? undefined : error}>
          <Input type="date" value={from} max={to || undefined} onChange={(e) => setFrom(e.target.value)} />
        </FormField>
        <FormField label="To" className="w-40" error={error && from > to ? error : undefined}>
          <Input type="date" value={to} min={from || undefined} onChange={(e) => setTo(e.target.value)} />
        </FormField>
        <Button type="submit" variant="secondary">
          Apply dates
        </Button>
      </form>
    </fieldset>
  );
}
