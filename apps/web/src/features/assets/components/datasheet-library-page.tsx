import type { UseMutationResult, UseQueryResult } from '@tanstack/react-query';
import { useState, type ComponentType, type ReactNode } from 'react';
import { useSearchParams } from 'react-router';
import { toast } from '@/lib/toast';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Icon } from '@/components/ui/icon';
import { PageHeader } from '@/components/ui/page-header';
import { Pagination } from '@/components/ui/pagination';
import { toSearch } from '@/config/paths';
import { libraryListSearch, parseLibraryListParams, type LibraryListParams } from '../lib/list-params';
import { DeleteDatasheetDialog } from './delete-datasheet-dialog';
import { LibraryActionsContext } from './library-actions-context';
import { LibraryFilters } from './library-filters';
import { LibraryTabs } from './library-tabs';
import type { DatasheetRow, DatasheetTableProps } from './datasheet-table';

type Page<T> = { items: T[]; total: number; page: number; pageSize: number };

/** What makes one datasheet library (modules, inverters) differ from the other. */
export type DatasheetLibraryKind<T extends DatasheetRow> = {
  /** One of it in words, lower case: "module". */
  noun: string;
  /** Many of it in words, lower case: "modules". */
  plural: string;
  /** What an archived datasheet is no longer offered for: "strings". */
  archivedFor: string;
  searchPlaceholder: string;
  errorTitle: string;
  emptyTitle: string;
  emptyDescription: string;
  useModels: (params: LibraryListParams) => UseQueryResult<Page<T>>;
  useSetArchived: () => UseMutationResult<T, Error, { id: number; isArchived: boolean }>;
  useDelete: () => UseMutationResult<undefined, Error, number>;
  Table: ComponentType<DatasheetTableProps<T>>;
  Dialog: ComponentType<{ isOpen: boolean; model: T | null; onClose: () => void }>;
};

/** A datasheet library page: search, the table with its row actions, paging, and the add/edit/delete dialogs. */
export function DatasheetLibraryPage<T extends DatasheetRow>({ kind, canWrite }: { kind: DatasheetLibraryKind<T>; canWrite: boolean }) {
  const { Table, Dialog } = kind;
  const [searchParams, setSearchParams] = useSearchParams();
  const params = parseLibraryListParams(searchParams);
  const models = kind.useModels(params);
  const archive = kind.useSetArchived();
  const remove = kind.useDelete();
  const [editing, setEditing] = useState<{ model: T | null } | null>(null);
  const [deleting, setDeleting] = useState<T | null>(null);

  const update = (changes: Partial<LibraryListParams>, options: { replace?: boolean } = {}) =>
    setSearchParams(toSearch(libraryListSearch({ ...params, page: 1, ...changes })), { replace: options.replace ?? false, preventScrollReset: true });

  const toggleArchived = (model: T) =>
    archive.mutate(
      { id: model.id, isArchived: !model.isArchived },
      {
        onSuccess: (saved) => toast.success(saved.isArchived ? `${saved.model} is archived: no longer offered for new ${kind.archivedFor}` : `${saved.model} is back in the library`),
        onError: (error) => toast.error(`${model.model} was not changed`, { description: error.message }),
      },
    );

  const closeDelete = () => {
    setDeleting(null);
    remove.reset();
  };

  const data = models.data;
  const addButton: ReactNode = canWrite ? (
    <Button variant="primary" onClick={() => setEditing({ model: null })}>
      <Icon name="plus" /> Add {kind.noun}
    </Button>
  ) : null;

  return (
    <>
      <PageHeader title="Datasheets" description="Module and inverter datasheets the sizing checks and expected values are computed from." actions={addButton} />
      <LibraryTabs />
      <LibraryFilters value={params} placeholder={kind.searchPlaceholder} onChange={(changes) => update(changes, { replace: 'q' in changes })} />

      {models.isError && !data ? (
        <ErrorState title={kind.errorTitle} error={models.error} onRetry={() => void models.refetch()} isRetrying={models.isFetching} />
      ) : (
        <LibraryActionsContext
          value={{
            canWrite,
            onEdit: (model: T) => setEditing({ model }),
            onToggleArchived: toggleArchived,
            onDelete: setDeleting,
            pendingId: archive.isPending ? (archive.variables?.id ?? null) : null,
          }}
        >
          <Table
            models={data?.items ?? []}
            isLoading={models.isPending}
            isFetching={models.isPlaceholderData}
            emptyState={
              params.q ? (
                <EmptyState
                  icon="search"
                  title={`No ${kind.noun} matches “${params.q}”`}
                  description={params.includeArchived ? 'Try the maker or part of the model name.' : 'It may be archived: tick “Show archived”.'}
                  action={
                    <Button variant="secondary" onClick={() => update({ q: '' })}>
                      Clear search
                    </Button>
                  }
                />
              ) : (
                <EmptyState icon="file" title={kind.emptyTitle} description={kind.emptyDescription} action={addButton} />
              )
            }
          />
          {data && data.total > 0 ? (
            <Pagination className="mt-5" page={data.page} pageSize={data.pageSize} total={data.total} itemLabel={kind.plural} onPageChange={(page) => update({ page })} />
          ) : null}
        </LibraryActionsContext>
      )}

      {canWrite ? (
        <>
          <Dialog isOpen={editing !== null} model={editing?.model ?? null} onClose={() => setEditing(null)} />
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
