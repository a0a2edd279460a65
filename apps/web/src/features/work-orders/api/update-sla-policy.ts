import { slaPolicySchema, type SlaPolicy } from '@stringfield/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { workOrderKeys } from './keys';

/** Sets a site's hours to repair per priority (admins). New tickets use them; open tickets keep their due time. */
export function updateSlaPolicy({ siteId, policy }: { siteId: number; policy: SlaPolicy }) {
  return api.put(`/api/sites/${siteId}/sla`, policy, slaPolicySchema);
}

export function useUpdateSlaPolicy() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateSlaPolicy,
    onSuccess: (policy, { siteId }) => queryClient.setQueryData(workOrderKeys.sla(siteId), policy),
  });
}
