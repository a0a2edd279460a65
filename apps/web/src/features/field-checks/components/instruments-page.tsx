import { instrumentKindLabels, type Instrument } from '@stringfield/shared';
import { useState } from 'react';
import { toast } from '@/lib/toast';
import { Badge } from '@/components/ui/badge';
import { Button } from '@/components/ui/button';
import { Checkbox } from '@/components/ui/checkbox';
import { ConfirmDialog } from '@/components/ui/dialog';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { useInstruments } from '../api/get-instruments';
import { useUpdateInstrument } from '../api/update-instrument';
import { calibrationLabel, calibrationStatus } from '../lib/calibration';
import { localDay } from '../lib/format';
import { InstrumentDialog } from './instrument-dialog';

/** The instrument register: serials, calibration due dates, archive. */
export function InstrumentsPage() {
  const [showArchived, setShowArchived] = useState(false);
  const list = useInstruments(showArchived);
  const update = useUpdateInstrument();
  const [editing, setEditing] = useState<Instrument | 'new' | null>(null);
  const [archiving, setArchiving] = useState<Instrument | null>(null);
  const today = localDay();

  const setArchived = (instrument: Instrument, isArchived: boolean) =>
    update.mutate(
      { id: instrument.id, changes: { isArchived } },
      {
        onSuccess: (saved) => {
          toast.success(isArchived ? `${saved.serial} archived` : `${saved.serial} back in use`);
          setArchiving(null);
        },
        onError: (error) => toast.error(error.message),
      },
    );

  const items = list.data ?? [];
  const overdueCount = items.filter((i) => !i.isArchived && calibrationStatus(i, today).kind === 'overdue').length;

  return (
    <div className="mx-auto max-w-4xl">
      <PageHeader
        title="Instruments"
        description="Meters, testers and sensors the crew measures with, and when each is due for calibration."
        actions={
          <Button variant="primary" onClick={() => setEditing('new')}>
            <Icon name="plus" /> Add instrument
          </Button>
        }
      />
      <div className="mb-4 flex flex-wrap items-center justify-between gap-3">
        <Checkbox label="Show archived instruments" checked={showArchived} onChange={(e) => setShowArchived(e.target.checked)} />
        {overdueCount > 0 ? <Badge tone="fail">{overdueCount} past calibration</Badge> : null}
      </div>

      {list.isPending ? (
        <LoadingRegion label="Loading the instruments" className="flex flex-col gap-3">
          <Skeleton className="h-24 w-full rounded-card" />
          <Skeleton className="h-24 w-full rounded-card" />
        </LoadingRegion>
      ) : list.isError && !list.data ? (
        <ErrorState title="The instruments did not load" error={list.error} onRetry={() => void list.refetch()} isRetrying={list.isFetching} />
      ) : items.length === 0 ? (
        <EmptyState
          icon="settings"
          title={showArchived ? 'No instruments at all' : 'No instruments in the register'}
          description="Add each multimeter, clamp meter, insulation tester and irradiance meter with its calibration date, so every check records what it was measured with."
          action={
            <Button variant="primary" onClick={() => setEditing('new')}>
              <Icon name="plus" /> Add the first instrument
            </Button>
          }
        />
      ) : (
        <ul className="flex flex-col gap-3">
          {items.map((i) => {
            const status = calibrationStatus(i, today);
            return (
              <li key={i.id} className={i.isArchived ? 'opacity-70' : undefined}>
                <article className="flex flex-col gap-3 rounded-card border border-line bg-surface p-4 shadow-card sm:flex-row sm:items-center">
                  <div className="min-w-0 flex-1">
                    <p className="text-sm font-semibold text-ink-muted">{instrumentKindLabels[i.kind]}</p>
                    <h2 className="readings text-lg font-bold">{i.serial}</h2>
                    {i.model ? <p className="text-ink-muted">{i.model}</p> : null}
                    <div className="mt-2 flex flex-wrap gap-2">
                      <Badge tone={status.kind === 'overdue' ? 'fail' : status.kind === 'due-soon' ? 'attention' : 'pass'}>{calibrationLabel(status, i.calibrationDueOn)}</Badge>
                      {i.isArchived ? <Badge tone="neutral">Archived</Badge> : null}
                    </div>
                  </div>
                  <div className="grid grid-cols-2 gap-2 sm:flex">
                    <Button variant="secondary" onClick={() => setEditing(i)} aria-label={`Edit ${i.serial}`}>
                      <Icon name="pencil" /> Edit
                    </Button>
                    {i.isArchived ? (
                      <Button variant="secondary" onClick={() => setArchived(i, false)} isPending={update.isPending && update.variables.id === i.id} aria-label={`Restore ${i.serial}`}>
                        <Icon name="undo" /> Restore
                      </Button>
                    ) : (
                      <Button variant="secondary" onClick={() => setArchiving(i)} aria-label={`Archive ${i.serial}`}>
                        <Icon name="inbox" /> Archive
                      </Button>
                    )}
                  </div>
                </article>
              </li>
            );
          })}
        </ul>
      )}

      {editing !== null ? <InstrumentDialog key={editing === 'new' ? 'new' : editing.id} isOpen onClose={() => setEditing(null)} instrument={editing === 'new' ? null : editing} /> : null}
      <ConfirmDialog
        isOpen={archiving !== null}
        onClose={() => setArchiving(null)}
        onConfirm={() => archiving && setArchived(archiving, true)}
        isPending={update.isPending}
        title={archiving ? `Archive ${archiving.serial}?` : 'Archive?'}
        description="It leaves the list technicians pick from; checks already taken with it keep naming it. You can restore it later."
        confirmLabel="Archive instrument"
      />
    </div>
  );
}
