import { ListSearch } from './list-search';

/** Search by maker or model, and whether archived datasheets are listed too. */
export function LibraryFilters({
  value,
  placeholder,
  onChange,
}: {
  value: { q: string; includeArchived: boolean };
  placeholder: string;
  onChange: (next: { q?: string; includeArchived?: boolean }) => void;
}) {
  return (
    <div
      role="search"
      aria-label="Find a datasheet"
      className="mb-5 grid gap-4 rounded-card border border-line bg-surface p-4 shadow-card sm:grid-cols-[minmax(0,2fr)_auto] sm:items-end"
    >
      <ListSearch placeholder={placeholder} value={value.q} onSearch={(q) => onChange({ q })} />
      <label className="inline-flex min-h-touch cursor-pointer items-center gap-3 rounded-control px-1 font-semibold">
        <input
          type="checkbox"
          className="size-6 accent-brand"
          checked={value.includeArchived}
          onChange={(event) => onChange({ includeArchived: event.target.checked })}
        />
        Show archived
      </label>
    </div>
  );
}
