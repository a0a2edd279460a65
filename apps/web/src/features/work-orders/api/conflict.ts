import { workOrderDetailSchema, type WorkOrderDetail } from '@stringfield/shared';
import { errorBodyField, isApiError } from '@/lib/api-client';

/** Whether a write lost a race: the ticket changed since it was loaded, or is no longer in a state that allows it. */
export function isConflict(error: unknown): boolean {
  return isApiError(error) && error.status === 409;
}

/** The fresh ticket a 409 answer carries as `current`, when it does. */
export function conflictCurrent(error: unknown): WorkOrderDetail | undefined {
  return isConflict(error) ? errorBodyField(error, 'current', workOrderDetailSchema) : undefined;
}
