import { zodResolver } from '@hookform/resolvers/zod';
import { priorities, priorityLabels, slaPolicySchema, type SlaPolicy } from '@stringfield/shared';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { toast } from '@/lib/toast';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ErrorState } from '@/components/ui/error-state';
import { FormField, Input, Select } from '@/components/ui/form-field';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';
import { splitServerErrors } from '@/lib/form-errors';
import { useSlaPolicy } from '../api/get-sla-policy';
import { useSiteOptions } from '../api/get-sites';
import { useUpdateSlaPolicy } from '../api/update-sla-policy';
import { formatDuration } from '../lib/sla';

function PolicyForm({ siteId, initial }: { siteId: number; initial: SlaPolicy }) {
  const update = useUpdateSlaPolicy();
  const {
    register,
    handleSubmit,
    control,
    setError,
    formState: { errors, isDirty },
  } = useForm({ resolver: zodResolver(slaPolicySchema), defaultValues: initial });
  const values = useWatch({ control });

  const onSubmit = handleSubmit((policy) => {
    update.mutate(
      { siteId, policy },
      {
        onSuccess: () =>
          toast.success('Deadlines saved', {
            description: 'New tickets at this site use them; open tickets keep their due time.',
          }),
        onError: (error) => {
          const split = splitServerErrors(error, priorities);
          for (const [name, message] of split.fieldErrors) setError(name, { type: 'server', message });
          if (split.formError) setError('root', { type: 'server', message: split.formError });
        },
      },
    );
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <div aria-live="assertive" className="empty:hidden">
        {errors.root?.message ? <Alert tone="fail">{errors.root.message}</Alert> : null}
      </div>
      <div className="grid gap-4 sm:grid-cols-2">
        {priorities.map((p) => {
          const hours = values[p];
          return (
            <FormField
              key={p}
              label={`${priorityLabels[p]}, hours to repair`}
              hint={
                typeof hours === 'number' && hours >= 1
                  ? `= ${formatDuration(hours * 3_600_000)}`
                  : 'Whole hours, 1 to 1,440'
              }
              error={errors[p]?.message}
            >
              <Input
                type="number"
                inputMode="numeric"
                min={1}
                max={1440}
                step={1}
                className="readings"
                {...register(p, { valueAsNumber: true })}
              />
            </FormField>
          );
        })}
      </div>
      <div>
        <Button
          type="submit"
          variant="primary"
          isPending={update.isPending}
          disabled={!isDirty}
          className="w-full sm:w-auto"
        >
          Save deadlines
        </Button>
      </div>
    </form>
  );
}

/** Admins: hours to repair per priority, per site. */
export function SlaPolicyEditor() {
  const sites = useSiteOptions();
  const [chosen, setChosen] = useState<number | undefined>();
  const siteId = chosen ?? sites.data?.[0]?.id;
  const policy = useSlaPolicy(siteId);

  if (sites.isPending) return <Skeleton className="h-touch" />;
  if (sites.isError)
    return (
      <ErrorState
        title="Sites did not load"
        error={sites.error}
        onRetry={() => void sites.refetch()}
        isRetrying={sites.isFetching}
      />
    );
  if (sites.data.length === 0) return <p className="text-ink-muted">There are no sites yet.</p>;

  return (
    <div className="flex flex-col gap-5">
      <FormField label="Site">
        <Select value={siteId ?? ''} onChange={(event) => setChosen(Number(event.target.value))}>
          {sites.data.map((s) => (
            <option key={s.id} value={s.id}>
              {s.code} · {s.name}
            </option>
          ))}
        </Select>
      </FormField>
      {policy.isPending ? (
        <LoadingRegion label="Loading deadlines" className="grid gap-4 sm:grid-cols-2">
          {priorities.map((p) => (
            <Skeleton key={p} className="h-20" />
          ))}
        </LoadingRegion>
      ) : policy.isError ? (
        <ErrorState
          title="Deadlines did not load"
          error={policy.error}
          onRetry={() => void policy.refetch()}
          isRetrying={policy.isFetching}
        />
      ) : siteId ? (
        <PolicyForm
          key={`${siteId}:${priorities.map((p) => policy.data[p]).join(',')}`}
          siteId={siteId}
          initial={policy.data}
        />
      ) : null}
    </div>
  );
}
