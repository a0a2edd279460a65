import { inverterModelSchema } from '@stringfield/shared';
import { useQuery } from '@tanstack/react-query';
import type { LibraryListParams } from '../lib/list-params';
import { assetKeys } from './keys';
import { libraryListQuery } from './library-list-query';

const list = libraryListQuery('/api/inverter-models', inverterModelSchema, assetKeys.inverterModelList);

export const getInverterModels = list.fetchPage;

export const inverterModelsQueryOptions = list.options;

export function useInverterModels(params: LibraryListParams) {
  return useQuery(inverterModelsQueryOptions(params));
}
