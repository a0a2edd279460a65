import { can, type InverterModel } from '@stringfield/shared';
import { useState } from 'react';
import { useSearchParams } from 'react-router';
import { toast } from 'sonner';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { PageHeader } from '@/components/ui/page-header';
import { Pagination } from '@/components/ui/pagination';
import { toSearch } from '@/config/paths';
import { useDeleteInverterModel } from '@/features/assets/api/delete-inverter-model';
import { useInverterModels } from '@/features/assets/api/get-inverter-models';
import { useSetInverterModelArchived } from '@/features/assets/api/set-inverter-model-archived';
import { DeleteDatasheetDialog } from '@/features/assets/components/delete-datasheet-dialog';
import { LibraryActionsContext } from '@/features/assets/components/library-actions-context';
import { LibraryFilters } from '@/features/assets/components/library-filters';
import { LibraryTabs } from '@/features/assets/components/library-tabs';
import { InverterModelDialog } from '@/features/assets/components/inverter-model-dialog';
import { InverterModelsTable } from '@/features/assets/components/inverter-models-table';
import { libraryListSearch, parseLibraryListParams, type LibraryListParams } from '@/features/assets/lib/list-params';
import { useSessionUser } from '../session';

/** The inverter datasheet library: the input windows strings are checked against. */
export function InverterModelsRoute() {
  const user = useSessionUser();
  const canWrite = can(user.role, 'assets:write');
  const [searchParams, setSearchParams] = useSearchParams();
  const params = parseLibraryListParams(searchParams);
  const models = useInverterModels(params);
  const archive = useSetInverterModelArchived();
  const remove = useDeleteInverterModel();
  const [editing, setEditing] = useState<{ model: InverterModel | null } | null>(null);
  const [deleting, setDeleting] = useState<InverterModel | null>(null);

  const update = (changes: Partial<LibraryListParams>, options: { replace?: boolean } = {}) =>
    setSearchParams(toSearch(libraryListSearch({ ...params, page: 1, ...changes })), { replace: options.replace ?? false, preventScrollReset: true });

  const toggleArchived = (model: InverterModel) =>
    archive.mutate(
      { id: model.id, isArchived: !model.isArchived },
      {
        onSuccess: (saved) => toast.success(saved.isArchived ? `${saved.model} is archived: no longer offered for new inverters` : `${saved.model} is back in the library`),
        onError: (error) => toast.error(`${model.model} was not changed`, { description: error.message }),
      },
    );

  const closeDelete = () => {
    setDeleting(null);
    remove.reset();
  };

  const data = models.data;
  const addButton = canWrite ? (
    <Button variant="primary" onClick={() => setEditing({ model: null })}>
      <Icon name="plus" /> Add inverter
    </Button>
  ) : null;

  return (
    <>
      <PageHeader title="Datasheets" description="Module and inverter datasheets the sizing checks and expected values are computed from." actions={addButton} />
      <LibraryTabs />
      <LibraryFilters value={params} placeholder="Maker or model, like SDI-125K" onChange={(changes) => update(changes, { replace: 'q' in changes })} />

      {models.isError && !data ? (
        <ErrorState title="Inverter datasheets did not load" error={models.error} onRetry={() => void models.refetch()} isRetrying={models.isFetching} />
      ) : (
        <LibraryActionsContext
          value={{
            canWrite,
            onEdit: (model: InverterModel) => setEditing({ model }),
            onToggleArchived: toggleArchived,
            onDelete: setDeleting,
            pendingId: archive.isPending ? (archive.variables?.id ?? null) : null,
          }}
        >
          <InverterModelsTable
            models={data?.items ?? []}
            isLoading={models.isPending}
            isFetching={models.isPlaceholderData}
            emptyState={
              params.q ? (
                <EmptyState
                  icon="search"
                  title={`No inverter matches “${params.q}”`}
                  description={params.includeArchived ? 'Try the maker or part of the model name.' : 'It may be archived: tick “Show archived”.'}
                  action={
                    <Button variant="secondary" onClick={() => update({ q: '' })}>
                      Clear search
                    </Button>
                  }
                />
              ) : (
                <EmptyState icon="file" title="No inverter datasheets yet" description="Add the inverters of your plants before registering them." action={addButton} />
              )
            }
          />
          {data && data.total > 0 ? (
            <Pagination className="mt-5" page={data.page} pageSize={data.pageSize} total={data.total} itemLabel="inverters" onPageChange={(page) => update({ page })} />
          ) : null}
        </LibraryActionsContext>
      )}

      {canWrite ? (
        <>
          <InverterModelDialog isOpen={editing !== null} model={editing?.model ?? null} onClose={() => setEditing(null)} />
          <DeleteDatasheetDialog
            isOpen={deleting !== null}
            name={deleting?.model ?? ''}
            isArchived={deleting?.isArchived ?? false}
            error={remove.error}
            isDeleting={remove.isPending}
            onClose={closeDelete}
            onDelete={() => {
              if (!deleting) return;
              remove.mutate(deleting.id, {
                onSuccess: () => {
                  toast.success(`${deleting.model} is deleted`);
                  closeDelete();
                },
              });
            }}
            onArchive={() => {
              if (!deleting) return;
              toggleArchived(deleting);
              closeDelete();
            }}
          />
        </>
      ) : null}
    </>
  );
}
