import { useId } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Icon } from '@/components/ui/icon';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { cn } from '@/lib/cn';
import { useTechnicians } from '../api/get-technicians';

/**
 * A radio list of active technicians with how many open tickets each already holds, so the load
 * can be spread. Each row is a full 48 px target.
 */
export function TechnicianPicker({
  value,
  onChange,
  error,
  currentAssigneeId,
  legend = 'Technician',
}: {
  value: number | undefined;
  onChange: (id: number) => void;
  error?: string | undefined;
  currentAssigneeId?: number | undefined;
  legend?: string;
}) {
  const technicians = useTechnicians();
  const name = useId();
  const errorId = `${name}-error`;

  return (
    <fieldset aria-describedby={error ? errorId : undefined} className="flex flex-col gap-2">
      <legend className="mb-1.5 font-semibold text-ink">{legend}</legend>
      {technicians.isPending ? (
        <LoadingRegion label="Loading technicians" className="flex flex-col gap-2">
          {[0, 1, 2].map((i) => (
            <Skeleton key={i} className="h-touch w-full" />
          ))}
        </LoadingRegion>
      ) : technicians.isError ? (
        <Alert tone="fail" title="The technicians did not load">
          <p>{technicians.error.message}</p>
          <Button
            variant="secondary"
            className="mt-2"
            onClick={() => void technicians.refetch()}
            isPending={technicians.isFetching}
          >
            Try again
          </Button>
        </Alert>
      ) : technicians.data.length === 0 ? (
        <Alert tone="attention">
          There are no active field technicians. An administrator can invite one under People.
        </Alert>
      ) : (
        <ul className="flex max-h-72 flex-col gap-2 overflow-y-auto p-0.5">
          {technicians.data.map((tech) => {
            const isChecked = value === tech.id;
            return (
              <li key={tech.id}>
                <label
                  className={cn(
                    'flex min-h-touch cursor-pointer items-center gap-3 rounded-control border-2 px-3 py-2',
                    isChecked ? 'border-brand bg-brand-soft' : 'border-line bg-surface hover:border-edge',
                  )}
                >
                  <input
                    type="radio"
                    name={name}
                    value={tech.id}
                    checked={isChecked}
                    onChange={() => onChange(tech.id)}
                    className="size-6 accent-brand"
                  />
                  <span className="min-w-0 flex-1">
                    <span className="font-semibold">{tech.name}</span>
                    {tech.id === currentAssigneeId ? (
                      <span className="ml-2 text-sm text-ink-muted">(assigned now)</span>
                    ) : null}
                  </span>
                  <span className="readings text-sm whitespace-nowrap text-ink-muted">
                    {tech.openCount === 0 ? 'no open tickets' : `${tech.openCount} open`}
                  </span>
                </label>
              </li>
            );
          })}
        </ul>
      )}
      <div aria-live="polite">
        {error ? (
          <p id={errorId} className="flex items-start gap-1.5 font-medium text-fail">
            <Icon name="fail" className="mt-0.5 size-5" />
            {error}
          </p>
        ) : null}
      </div>
    </fieldset>
  );
}
