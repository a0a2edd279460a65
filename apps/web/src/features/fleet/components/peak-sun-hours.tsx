import type { Site } from '@stringfield/shared';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Input } from '@/components/ui/form-field';
import { Icon } from '@/components/ui/icon';
import { isApiError } from '@/lib/api-client';
import { useUpdatePeakSunHours } from '../api/update-peak-sun-hours';
import { formatNumber } from '../lib/format';

/** Peak sun hours accepted by the API (h/day); outside this a daily estimate means nothing. */
const MIN_H = 0.5;
const MAX_H = 12;

/**
 * A site's assumed peak sun hours, the multiplier behind the daily kWh estimate. Editable in place
 * for those allowed to change sites; read-only text for everyone else.
 */
export function PeakSunHours({ site, canEdit, onSaved }: { site: Site; canEdit: boolean; onSaved?: () => void }) {
  const [draft, setDraft] = useState<string | null>(null);
  const update = useUpdatePeakSunHours();
  const inputId = `psh-${site.id}`;
  const errorId = `${inputId}-error`;

  const value = (
    <span className="readings font-semibold">
      {formatNumber(site.peakSunHours, 1)} h/day
    </span>
  );
  if (!canEdit)
    return (
      <span>
        {site.code}: {value}
      </span>
    );

  if (draft === null)
    return (
      <span className="inline-flex flex-wrap items-center gap-2">
        <span>
          {site.code}: {value}
        </span>
        <Button variant="ghost" className="-my-1 px-3" onClick={() => setDraft(String(site.peakSunHours))}>
          <Icon name="pencil" /> Edit<span className="sr-only"> peak sun hours of {site.code}</span>
        </Button>
      </span>
    );

  const parsed = Number(draft.replace(',', '.'));
  const localError = draft.trim() === '' || !Number.isFinite(parsed) ? 'Enter hours per day, like 4.5' : parsed < MIN_H || parsed > MAX_H ? `Use ${MIN_H} to ${MAX_H} h/day` : undefined;
  const serverError = update.isError ? (isApiError(update.error) ? (update.error.fields?.peakSunHours ?? update.error.message) : 'The change was not saved. Try again.') : undefined;
  const error = serverError;

  return (
    <form
      className="inline-flex flex-wrap items-start gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        if (localError) return;
        update.mutate(
          { siteId: site.id, peakSunHours: parsed },
          {
            onSuccess: () => {
              setDraft(null);
              onSaved?.();
            },
          },
        );
      }}
    >
      <label htmlFor={inputId} className="self-center">
        {site.code} peak sun hours
      </label>
      <span className="flex flex-col gap-1">
        <span className="flex items-center gap-1">
          <Input
            id={inputId}
            className="w-24"
            inputMode="decimal"
            value={draft}
            aria-invalid={Boolean(localError || error) || undefined}
            aria-describedby={errorId}
            onChange={(e) => setDraft(e.target.value)}
            onKeyDown={(e) => {
              if (e.key === 'Escape') setDraft(null);
            }}
            // eslint-disable-next-line jsx-a11y/no-autofocus -- opened by pressing Edit; focus follows the press
            autoFocus
          />
          <span className="text-ink-muted">h/day</span>
        </span>
        <span id={errorId} aria-live="polite" className="text-sm font-medium text-fail">
          {localError ?? error ?? ''}
        </span>
      </span>
      <Button type="submit" variant="brand" isPending={update.isPending} disabled={Boolean(localError) || update.isPending}>
        Save
      </Button>
      <Button variant="ghost" onClick={() => setDraft(null)}>
        Cancel
      </Button>
    </form>
  );
}
