import { moduleModelSchema } from '@stringfield/shared';
import { useQuery } from '@tanstack/react-query';
import type { LibraryListParams } from '../lib/list-params';
import { assetKeys } from './keys';
import { libraryListQuery } from './library-list-query';

const list = libraryListQuery('/api/module-models', moduleModelSchema, assetKeys.moduleModelList);

export const getModuleModels = list.fetchPage;

export const moduleModelsQueryOptions = list.options;

export function useModuleModels(params: LibraryListParams) {
  return useQuery(moduleModelsQueryOptions(params));
}
