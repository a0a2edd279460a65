import { photoSchema } from '@stringfield/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';
import { evidenceKeys } from './keys';

export const photosResponseSchema = z.object({ items: z.array(photoSchema) });

/** Every photo of a ticket, oldest first, each with its thermal finding if one is recorded. */
export function getPhotos(workOrderId: number, signal?: AbortSignal) {
  return api.get(`/api/work-orders/${workOrderId}/photos`, photosResponseSchema, { signal }).then((r) => r.items);
}

export const photosQueryOptions = (workOrderId: number) =>
  queryOptions({
    queryKey: evidenceKeys.photos(workOrderId),
    queryFn: ({ signal }) => getPhotos(workOrderId, signal),
  });

export function usePhotos(workOrderId: number) {
  return useQuery(photosQueryOptions(workOrderId));
}
