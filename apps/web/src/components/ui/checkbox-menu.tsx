import { useEffect, useId, useRef } from 'react';
import { cn } from '@/lib/cn';
import { Icon } from './icon';

type Option<T extends string> = { value: T; label: string };

/**
 * A multi-choice filter that folds away: a button that reads like a select ("Status: 3 of 7") and
 * opens a list of checkboxes. Built on <details>, so it works with the keyboard and without script;
 * a press outside or Escape closes it.
 */
export function CheckboxMenu<T extends string>({
  label,
  options,
  value,
  onChange,
  allLabel = 'Any',
  summary: summaryOverride,
  className,
}: {
  label: string;
  options: readonly Option<T>[];
  value: readonly T[];
  onChange: (next: T[]) => void;
  /** What the button says when nothing (meaning everything) is ticked. */
  allLabel?: string;
  /** Words for the current choice when they say more than a count (e.g. "Open tickets"). */
  summary?: string | undefined;
  className?: string;
}) {
  const ref = useRef<HTMLDetailsElement>(null);
  const labelId = useId();

  useEffect(() => {
    const onPointer = (event: PointerEvent) => {
      if (ref.current?.open && !ref.current.contains(event.target as Node)) ref.current.open = false;
    };
    const onKey = (event: KeyboardEvent) => {
      if (event.key !== 'Escape' || !ref.current?.open || !ref.current.contains(document.activeElement))
        return;
      ref.current.open = false;
      ref.current.querySelector('summary')?.focus();
    };
    document.addEventListener('pointerdown', onPointer);
    document.addEventListener('keydown', onKey);
    return () => {
      document.removeEventListener('pointerdown', onPointer);
      document.removeEventListener('keydown', onKey);
    };
  }, []);

  const summary =
    summaryOverride ??
    (value.length === 0 || value.length === options.length
      ? allLabel
      : value.length <= 2
        ? options
            .filter((o) => value.includes(o.value))
            .map((o) => o.label)
            .join(', ')
        : `${value.length} of ${options.length}`);

  return (
    <div className={cn('flex flex-col gap-1.5', className)}>
      <span id={labelId} className="font-semibold text-ink">
        {label}
      </span>
      <details ref={ref} className="group relative">
        <summary
          aria-labelledby={labelId}
          aria-describedby={`${labelId}-value`}
          className="flex min-h-touch cursor-pointer list-none items-center justify-between gap-2 rounded-control border-2 border-edge bg-surface px-3 text-base hover:border-ink-muted [&::-webkit-details-marker]:hidden"
        >
          <span id={`${labelId}-value`} className="truncate">
            {summary}
          </span>
          <Icon name="chevronDown" className="text-ink-muted group-open:rotate-180" />
        </summary>
        <fieldset className="absolute z-20 mt-1 flex w-max max-w-[min(20rem,calc(100vw-2rem))] min-w-full flex-col rounded-control border-2 border-edge bg-surface p-2 shadow-raised">
          <legend className="sr-only">{label}</legend>
          {options.map((option) => (
            <label
              key={option.value}
              className="flex min-h-touch cursor-pointer items-center gap-3 rounded-control px-2 hover:bg-sunken"
            >
              <input
                type="checkbox"
                className="size-6 accent-brand"
                checked={value.includes(option.value)}
                onChange={(event) =>
                  onChange(
                    event.target.checked ? [...value, option.value] : value.filter((v) => v !== option.value),
                  )
                }
              />
              {option.label}
            </label>
          ))}
          {value.length > 0 ? (
            <button
              type="button"
              className="mt-1 min-h-touch rounded-control px-2 text-left font-semibold text-brand hover:bg-sunken"
              onClick={() => onChange([])}
            >
              Clear ({allLabel.toLowerCase()})
            </button>
          ) : null}
        </fieldset>
      </details>
    </div>
  );
}
