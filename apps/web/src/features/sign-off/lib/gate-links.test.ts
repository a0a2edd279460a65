import type { Gate } from '@stringfield/shared';
import { describe, expect, it } from 'vitest';
import { blockingCount, linkForMissing } from './gate-links';

const item = (stringId: number | null, overridable = false) => ({ message: 'INV07-MPPT3-S2: missing', stringId, overridable });
const supervisor = { workOrderId: 15, canWork: false };
const technician = { workOrderId: 15, canWork: true };

describe('linkForMissing', () => {
  it('sends the supervisor to the string on the ticket page for a missing after check', () => {
    expect(linkForMissing('AFTER_CHECK_PASS', item(154), supervisor)).toEqual({ href: '#string-154', label: 'Go to the string', isInPage: true });
  });

  it('sends the technician in the field to that string’s check on the field page', () => {
    expect(linkForMissing('AFTER_CHECK_PASS', item(154), technician)).toEqual({ href: '/work-orders/15/field?string=154', label: 'Record the after check', isInPage: false });
    expect(linkForMissing('INSULATION_RECORDED', item(154), technician)?.href).toBe('/work-orders/15/field?string=154');
  });

  it('points a missing after photo at the gallery, or at the upload for the technician', () => {
    expect(linkForMissing('AFTER_PHOTO', item(154), supervisor)?.href).toBe('#evidence-gallery');
    expect(linkForMissing('AFTER_PHOTO', item(154), technician)?.href).toBe('#photo-upload');
  });

  it('points an incomplete diode record at the diode records', () => {
    expect(linkForMissing('DIODE_RECORDS_COMPLETE', item(154), supervisor)?.href).toBe('#diode-records');
  });

  it('has nothing to link for items still on the technician’s phone, or a check without a string', () => {
    expect(linkForMissing('NO_PENDING_OFFLINE_ITEMS', item(null), supervisor)).toBeNull();
    expect(linkForMissing('AFTER_CHECK_PASS', item(null), supervisor)).toBeNull();
  });
});

describe('blockingCount', () => {
  const gates: Gate[] = [
    { code: 'AFTER_CHECK_PASS', label: '', ok: false, missing: [item(154, true), item(155, false)] },
    { code: 'AFTER_PHOTO', label: '', ok: false, missing: [item(154)] },
    { code: 'DIODE_RECORDS_COMPLETE', label: '', ok: true, missing: [] },
  ];
  it('counts every missing item until an override covers an overridable one', () => {
    expect(blockingCount(gates, new Set())).toBe(3);
    expect(blockingCount(gates, new Set([154]))).toBe(2);
  });
  it('never lets an override lift an item that is not overridable', () => {
    expect(blockingCount(gates, new Set([155]))).toBe(3);
  });
});
