import { can, type InverterModel } from '@stringfield/shared';
import { useDeleteInverterModel } from '@/features/assets/api/delete-inverter-model';
import { useInverterModels } from '@/features/assets/api/get-inverter-models';
import { useSetInverterModelArchived } from '@/features/assets/api/set-inverter-model-archived';
import { DatasheetLibraryPage, type DatasheetLibraryKind } from '@/features/assets/components/datasheet-library-page';
import { InverterModelDialog } from '@/features/assets/components/inverter-model-dialog';
import { InverterModelsTable } from '@/features/assets/components/inverter-models-table';
import { useSessionUser } from '../session';

const inverters: DatasheetLibraryKind<InverterModel> = {
  noun: 'inverter',
  plural: 'inverters',
  archivedFor: 'inverters',
  searchPlaceholder: 'Maker or model',
  errorTitle: 'Inverter datasheets did not load',
  emptyTitle: 'No inverter datasheets yet',
  emptyDescription: 'Add the inverters of your plants before registering them.',
  useModels: useInverterModels,
  useSetArchived: useSetInverterModelArchived,
  useDelete: useDeleteInverterModel,
  Table: InverterModelsTable,
  Dialog: InverterModelDialog,
};

/** The inverter datasheet library: the input windows strings are checked against. */
export function InverterModelsRoute() {
  const user = useSessionUser();
  return <DatasheetLibraryPage kind={inverters} canWrite={can(user.role, 'assets:write')} />;
}
