import type { Instrument } from '@stringfield/shared';

export type CalibrationStatus =
  | { kind: 'overdue'; days: number }
  | { kind: 'due-soon'; days: number }
  | { kind: 'ok'; days: number };

const DAY_MS = 86_400_000;

/** Whole days from `day` (YYYY-MM-DD) to the due date; negative once past it. */
function daysUntil(dueOn: string, day: string): number {
  return Math.round((Date.parse(`${dueOn}T00:00:00Z`) - Date.parse(`${day}T00:00:00Z`)) / DAY_MS);
}

/**
 * Calibration state on a given day. Past the due date is overdue (the server flags readings taken with
 * it); within 30 days is a reminder to book the lab.
 */
export function calibrationStatus(instrument: Pick<Instrument, 'calibrationDueOn'>, day: string): CalibrationStatus {
  const days = daysUntil(instrument.calibrationDueOn, day);
  if (days < 0) return { kind: 'overdue', days: -days };
  if (days <= 30) return { kind: 'due-soon', days };
  return { kind: 'ok', days };
}

/** Instruments among `selectedIds` that are past calibration on `day` (the same rule the server applies). */
export function overdueInstruments(instruments: readonly Instrument[], selectedIds: readonly number[], day: string): Instrument[] {
  const selected = new Set(selectedIds);
  return instruments.filter((i) => selected.has(i.id) && i.calibrationDueOn < day);
}

/** Plain words for the badge beside an instrument. */
export function calibrationLabel(status: CalibrationStatus, dueOn: string): string {
  if (status.kind === 'overdue') return `Calibration overdue since ${dueOn}`;
  if (status.kind === 'due-soon') return status.days === 0 ? 'Calibration due today' : `Calibration due in ${status.days} day${status.days === 1 ? '' : 's'}`;
  return `Calibrated until ${dueOn}`;
}
