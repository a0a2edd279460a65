import type { Site } from '@stringfield/shared';
import { FormField, Select } from '@/components/ui/form-field';

/** Picks one of the sites the person may see; `allLabel` adds an "every site" choice. */
export function SiteSelect({
  sites,
  value,
  onChange,
  allLabel,
  label = 'Site',
  className,
}: {
  sites: readonly Site[];
  value: number | undefined;
  onChange: (siteId: number | undefined) => void;
  allLabel?: string;
  label?: string;
  className?: string;
}) {
  return (
    <FormField label={label} className={className}>
      <Select value={value === undefined ? '' : String(value)} onChange={(e) => onChange(e.target.value ? Number(e.target.value) : undefined)}>
        {allLabel ? <option value="">{allLabel}</option> : value === undefined ? <option value="">Choose a site</option> : null}
        {sites.map((s) => (
          <option key={s.id} value={s.id}>
            {s.code} · {s.name}
          </option>
        ))}
      </Select>
    </FormField>
  );
}
