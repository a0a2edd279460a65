/** Query keys for sign-off, from one place; a sign-off invalidates every key of its ticket. */
export const signOffKeys = {
  all: ['sign-off'] as const,
  ticket: (workOrderId: number) => [...signOffKeys.all, workOrderId] as const,
  gates: (workOrderId: number) => [...signOffKeys.ticket(workOrderId), 'gates'] as const,
  record: (workOrderId: number) => [...signOffKeys.ticket(workOrderId), 'record'] as const,
};
