import { useEffect, useRef, useState } from 'react';
import { FormField, Input } from '@/components/ui/form-field';
import { Icon } from '@/components/ui/icon';

/** A search box that asks the server only after a pause in typing (300 ms), or at once on Enter. */
export function ListSearch({
  label = 'Search',
  placeholder,
  value,
  onSearch,
  className,
}: {
  label?: string;
  placeholder: string;
  value: string;
  onSearch: (q: string) => void;
  className?: string;
}) {
  const [query, setQuery] = useState(value);
  const [synced, setSynced] = useState(value);
  const timer = useRef<number | undefined>(undefined);

  // Back/forward can change q under us; follow it.
  if (value !== synced) {
    setSynced(value);
    setQuery(value);
  }

  useEffect(() => () => window.clearTimeout(timer.current), []);

  return (
    <FormField label={label} className={className}>
      <div className="relative">
        <Icon name="search" className="pointer-events-none absolute top-1/2 left-3 -translate-y-1/2 text-ink-muted" />
        <Input
          type="search"
          placeholder={placeholder}
          className="pl-10"
          value={query}
          autoComplete="off"
          spellCheck={false}
          onChange={(event) => {
            const next = event.target.value;
            setQuery(next);
            window.clearTimeout(timer.current);
            timer.current = window.setTimeout(() => onSearch(next), 300);
          }}
          onKeyDown={(event) => {
            if (event.key !== 'Enter') return;
            event.preventDefault();
            window.clearTimeout(timer.current);
            onSearch(query);
          }}
        />
      </div>
    </FormField>
  );
}
