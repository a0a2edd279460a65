import { diodeTypes, type DiodeReplacement, type diodeFailureModes, type diodeFoundBy, type diodeReplacementInputSchema } from '@stringfield/shared';
import type { z } from 'zod';

export type DiodeFormValues = z.input<typeof diodeReplacementInputSchema>;

export const failureModeLabels: Record<(typeof diodeFailureModes)[number], string> = {
  short: 'Shorted',
  open: 'Open',
  burnt: 'Burnt',
  cracked_solder: 'Cracked solder joint',
  other: 'Other',
};
export const foundByLabels: Record<(typeof diodeFoundBy)[number], string> = {
  voc_deficit: 'Voc deficit on the string check',
  thermal_image: 'Thermal image',
  diode_test: 'Diode test (multimeter)',
};
export const diodeTypeLabels: Record<(typeof diodeTypes)[number], string> = { schottky: 'Schottky', pn: 'p-n junction' };

/** The fields the form shows, for mapping the server's field errors (nested ones dotted). */
export const diodeFieldNames = [
  'stringId',
  'modulePosition',
  'moduleSerial',
  'diodePosition',
  'failureMode',
  'foundBy',
  'removedPart.partNumber',
  'removedPart.ratingA',
  'removedPart.ratingV',
  'removedPart.type',
  'installedPart.partNumber',
  'installedPart.ratingA',
  'installedPart.ratingV',
  'installedPart.type',
  'newDiodeForwardV',
  'vocBeforeV',
  'vocAfterV',
  'beforePhotoId',
  'afterPhotoId',
  'notes',
] as const;
export type DiodeFieldName = (typeof diodeFieldNames)[number];

function num(v: unknown): number | undefined {
  return typeof v === 'number' && Number.isFinite(v) ? v : undefined;
}
function text(v: unknown): string {
  return typeof v === 'string' ? v : '';
}
function diodeType(v: unknown): (typeof diodeTypes)[number] | undefined {
  return (diodeTypes as readonly unknown[]).includes(v) ? (v as (typeof diodeTypes)[number]) : undefined;
}

/**
 * The form's starting values: a stored record to complete (PUT sends the whole record again), or a
 * new one on the ticket's only string.
 */
export function diodeFormDefaults(record: DiodeReplacement | null, options: { stringId?: number } = {}): Partial<DiodeFormValues> {
  if (!record) {
    return {
      stringId: options.stringId,
      moduleSerial: '',
      removedPart: { partNumber: '' },
      installedPart: { partNumber: '', type: 'schottky' } as DiodeFormValues['installedPart'],
      beforePhotoId: null,
      afterPhotoId: null,
      notes: '',
    };
  }
  return {
    stringId: record.stringId,
    modulePosition: record.modulePosition,
    moduleSerial: record.moduleSerial,
    diodePosition: record.diodePosition,
    failureMode: record.failureMode,
    foundBy: record.foundBy,
    removedPart: {
      partNumber: text(record.removedPart.partNumber),
      ratingA: num(record.removedPart.ratingA),
      ratingV: num(record.removedPart.ratingV),
      type: diodeType(record.removedPart.type),
    },
    installedPart: {
      partNumber: text(record.installedPart.partNumber),
      ratingA: num(record.installedPart.ratingA) as number,
      ratingV: num(record.installedPart.ratingV) as number,
      type: diodeType(record.installedPart.type) ?? 'schottky',
    },
    newDiodeForwardV: record.newDiodeForwardV,
    vocBeforeV: record.vocBeforeV,
    vocAfterV: record.vocAfterV,
    beforePhotoId: record.beforePhotoId,
    afterPhotoId: record.afterPhotoId,
    notes: record.notes,
  };
}
