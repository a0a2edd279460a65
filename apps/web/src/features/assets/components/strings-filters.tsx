import type { Inverter } from '@stringfield/shared';
import { Button } from '@/components/ui/button';
import { FormField, Select } from '@/components/ui/form-field';
import type { SizingFilter, StringSort, StringsListParams } from '../lib/list-params';
import { ListSearch } from './list-search';

const sortLabels: Record<StringSort, string> = {
  inverter: 'Inverter, then input',
  '-inverter': 'Inverter, last first',
  label: 'Label A–Z',
  '-label': 'Label Z–A',
  modulesInSeries: 'Fewest modules first',
  '-modulesInSeries': 'Most modules first',
};
const sizingLabels: Record<SizingFilter, string> = { all: 'All strings', fail: 'Failing a check', ok: 'Passing every check' };

type Filters = Pick<StringsListParams, 'q' | 'inverterId' | 'mpptInput' | 'sizing' | 'sort'>;

/** Search on the label, then narrow by inverter, MPPT input and sizing verdict. */
export function StringsFilters({ value, inverters, onChange }: { value: Filters; inverters: readonly Inverter[]; onChange: (next: Partial<Filters>) => void }) {
  const chosen = inverters.find((i) => i.id === value.inverterId);
  const inputCount = chosen ? chosen.mpptInputs : Math.max(0, ...inverters.map((i) => i.mpptInputs));
  const hasFilters = value.q !== '' || value.inverterId !== undefined || value.mpptInput !== undefined || value.sizing !== 'all';
  const toNumber = (text: string) => (text ? Number(text) : undefined);

  return (
    <div
      role="search"
      aria-label="Filter strings"
      className="mb-5 grid grid-cols-2 gap-x-3 gap-y-4 rounded-card border border-line bg-surface p-4 shadow-card sm:gap-x-4 lg:grid-cols-[repeat(4,minmax(0,1fr))_auto] lg:items-end"
    >
      <ListSearch className="col-span-full" label="Search labels" placeholder="Like INV08-MPPT1" value={value.q} onSearch={(q) => onChange({ q })} />
      <FormField label="Inverter">
        <Select
          value={value.inverterId ?? ''}
          onChange={(event) => {
            const inverterId = toNumber(event.target.value);
            const next = inverters.find((i) => i.id === inverterId);
            // Keep the input filter only if the newly chosen inverter has that input.
            const keepInput = value.mpptInput !== undefined && (!next || value.mpptInput <= next.mpptInputs);
            onChange({ inverterId, mpptInput: keepInput ? value.mpptInput : undefined });
          }}
        >
          <option value="">Every inverter</option>
          {inverters.map((inverter) => (
            <option key={inverter.id} value={inverter.id}>
              {inverter.tag} ({inverter.stringCount} strings)
            </option>
          ))}
        </Select>
      </FormField>
      <FormField label="MPPT input">
        <Select value={value.mpptInput ?? ''} onChange={(event) => onChange({ mpptInput: toNumber(event.target.value) })}>
          <option value="">Every input</option>
          {Array.from({ length: inputCount }, (_, k) => k + 1).map((n) => (
            <option key={n} value={n}>
              Input {n}
            </option>
          ))}
        </Select>
      </FormField>
      <FormField label="Sizing">
        <Select value={value.sizing} onChange={(event) => onChange({ sizing: event.target.value as SizingFilter })}>
          {(Object.keys(sizingLabels) as SizingFilter[]).map((sizing) => (
            <option key={sizing} value={sizing}>
              {sizingLabels[sizing]}
            </option>
          ))}
        </Select>
      </FormField>
      <FormField label="Sort by">
        <Select value={value.sort} onChange={(event) => onChange({ sort: event.target.value as StringSort })}>
          {(Object.keys(sortLabels) as StringSort[]).map((sort) => (
            <option key={sort} value={sort}>
              {sortLabels[sort]}
            </option>
          ))}
        </Select>
      </FormField>
      <Button
        variant="ghost"
        className="col-span-2 lg:col-span-1"
        disabled={!hasFilters}
        onClick={() => onChange({ q: '', inverterId: undefined, mpptInput: undefined, sizing: 'all' })}
      >
        Clear filters
      </Button>
    </div>
  );
}
