import type { Gate, GateCode } from '@stringfield/shared';
import { paths, ticketAnchors } from '@/config/paths';

export type GateLink = { href: string; label: string; isInPage: boolean };
export type MissingItem = Gate['missing'][number];

/**
 * Where a missing item is fixed. On the ticket page the links jump to the string, the gallery or
 * the diode records; the technician who can still work the ticket is sent to the field page for a
 * missing check instead, since that is where checks are recorded. Nothing to link for items that
 * live on the technician's phone.
 */
export function linkForMissing(code: GateCode, item: MissingItem, context: { workOrderId: number; canWork: boolean }): GateLink | null {
  const { workOrderId, canWork } = context;
  switch (code) {
    case 'AFTER_CHECK_PASS':
    case 'INSULATION_RECORDED':
      if (item.stringId === null) return null;
      if (canWork) return { href: paths.fieldChecks(workOrderId, { stringId: item.stringId }), label: 'Record the after check', isInPage: false };
      return { href: `#${ticketAnchors.string(item.stringId)}`, label: 'Go to the string', isInPage: true };
    case 'AFTER_PHOTO':
      return canWork
        ? { href: `#${ticketAnchors.upload}`, label: 'Upload an after photo', isInPage: true }
        : { href: `#${ticketAnchors.gallery}`, label: 'Go to the photos', isInPage: true };
    case 'DIODE_RECORDS_COMPLETE':
      return { href: `#${ticketAnchors.diodes}`, label: canWork ? 'Complete the diode record' : 'Go to the diode records', isInPage: true };
    case 'NO_PENDING_OFFLINE_ITEMS':
      return null;
  }
}

/** Items that only the technician can fix: every missing item that is not overridable. */
export function blockingCount(gates: readonly Gate[], overriddenStringIds: ReadonlySet<number>): number {
  let n = 0;
  for (const g of gates)
    for (const m of g.missing) {
      if (m.overridable && m.stringId !== null && overriddenStringIds.has(m.stringId)) continue;
      n += 1;
    }
  return n;
}
