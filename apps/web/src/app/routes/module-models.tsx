import { can, type ModuleModel } from '@stringfield/shared';
import { useDeleteModuleModel } from '@/features/assets/api/delete-module-model';
import { useModuleModels } from '@/features/assets/api/get-module-models';
import { useSetModuleModelArchived } from '@/features/assets/api/set-module-model-archived';
import { DatasheetLibraryPage, type DatasheetLibraryKind } from '@/features/assets/components/datasheet-library-page';
import { ModuleModelDialog } from '@/features/assets/components/module-model-dialog';
import { ModuleModelsTable } from '@/features/assets/components/module-models-table';
import { useSessionUser } from '../session';

const modules: DatasheetLibraryKind<ModuleModel> = {
  noun: 'module',
  plural: 'modules',
  archivedFor: 'strings',
  searchPlaceholder: 'Maker or model',
  errorTitle: 'Module datasheets did not load',
  emptyTitle: 'No module datasheets yet',
  emptyDescription: 'Add the modules of your plants before importing their layouts.',
  useModels: useModuleModels,
  useSetArchived: useSetModuleModelArchived,
  useDelete: useDeleteModuleModel,
  Table: ModuleModelsTable,
  Dialog: ModuleModelDialog,
};

/** The module datasheet library: every model strings can be built from. */
export function ModuleModelsRoute() {
  const user = useSessionUser();
  return <DatasheetLibraryPage kind={modules} canWrite={can(user.role, 'assets:write')} />;
}
