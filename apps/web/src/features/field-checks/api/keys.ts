/**
 * Query keys of field checks, from one place. Everything under `fieldCheckKeys.all` is kept on the
 * device (see app/provider.tsx), so the field page opens without signal after one online visit.
 */
export const fieldCheckKeys = {
  all: ['field-checks'] as const,
  ticketChecks: (workOrderId: number) => [...fieldCheckKeys.all, 'ticket-checks', workOrderId] as const,
  stringSpec: (stringId: number) => [...fieldCheckKeys.all, 'string-spec', stringId] as const,
  instruments: () => [...fieldCheckKeys.all, 'instruments'] as const,
  instrumentList: (includeArchived: boolean) => [...fieldCheckKeys.instruments(), { includeArchived }] as const,
  ivTrace: (checkId: number) => [...fieldCheckKeys.all, 'iv-trace', checkId] as const,
};
