/**
 * Query keys for a ticket's evidence, from one place. Uploads and thermal findings invalidate
 * `photos(workOrderId)`; diode records invalidate `diodes(workOrderId)` and every string history.
 */
export const evidenceKeys = {
  all: ['evidence'] as const,
  photos: (workOrderId: number) => [...evidenceKeys.all, 'photos', workOrderId] as const,
  diodes: (workOrderId: number) => [...evidenceKeys.all, 'diodes', workOrderId] as const,
  stringDiodesAll: () => [...evidenceKeys.all, 'string-diodes'] as const,
  stringDiodes: (stringId: number) => [...evidenceKeys.stringDiodesAll(), stringId] as const,
};
