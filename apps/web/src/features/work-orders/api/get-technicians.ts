import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '@/lib/api-client';
import { answeredEarly } from '@/lib/early-answers';
import { workOrderKeys } from './keys';

export const technicianSchema = z.object({ id: z.number(), name: z.string(), openCount: z.number() });
export type Technician = z.infer<typeof technicianSchema>;
const techniciansSchema = z.object({ items: z.array(technicianSchema) });

/** Active field technicians with how many open tickets each holds (dispatchers and admins only). */
export function getTechnicians(signal?: AbortSignal) {
  return api.get('/api/technicians', techniciansSchema, { signal });
}

export const techniciansQueryOptions = () =>
  answeredEarly(
    queryOptions({
      queryKey: workOrderKeys.technicians(),
      queryFn: ({ signal }) => getTechnicians(signal),
      select: (data) => data.items,
    }),
  );

export function useTechnicians(options: { isEnabled?: boolean } = {}) {
  return useQuery({ ...techniciansQueryOptions(), enabled: options.isEnabled ?? true });
}
