import type { Gate } from '@stringfield/shared';
import { describe, expect, it } from 'vitest';
import { buildOverrides, mapOverrideFieldErrors, overridableItems, overrideReasonStatus } from './overrides';

const reason = 'Irradiance dropped to 300 W/m² during the after check; Voc matches the neighbours.';

describe('overrideReasonStatus', () => {
  it('counts the trimmed characters live and says how many are still needed', () => {
    expect(overrideReasonStatus('  cloud  ')).toMatchObject({ count: 5, isValid: false, text: '5 of 20 characters — 15 more' });
    expect(overrideReasonStatus('x'.repeat(20))).toMatchObject({ count: 20, isValid: true });
    expect(overrideReasonStatus('')).toMatchObject({ isEmpty: true, isValid: false });
  });
});

describe('overridableItems', () => {
  it('lists each string whose after check exists but did not pass, once', () => {
    const gates: Gate[] = [
      {
        code: 'AFTER_CHECK_PASS',
        label: '',
        ok: false,
        missing: [
          { message: 'S2: the after check is "fail", not "pass"', stringId: 154, overridable: true },
          { message: 'S3: no after-repair check yet', stringId: 155, overridable: false },
        ],
      },
      { code: 'AFTER_PHOTO', label: '', ok: false, missing: [{ message: 'S2: no after photo', stringId: 154, overridable: false }] },
    ];
    expect(overridableItems(gates).map((o) => o.stringId)).toEqual([154]);
  });
});

describe('buildOverrides', () => {
  it('sends trimmed reasons of 20 characters or more', () => {
    expect(buildOverrides({ 154: `  ${reason}  ` }, [154])).toEqual({ overrides: [{ stringId: 154, reason }], errors: {} });
  });

  it('leaves blank reasons out: no override for that string', () => {
    expect(buildOverrides({ 154: '   ' }, [154])).toEqual({ overrides: [], errors: {} });
  });

  it('flags a reason under 20 characters beside its string instead of dropping it', () => {
    expect(buildOverrides({ 154: 'Cloudy' }, [154])).toEqual({ overrides: [], errors: { 154: 'Explain the override in at least 20 characters' } });
  });

  it('ignores reasons for strings that are no longer overridable', () => {
    expect(buildOverrides({ 154: reason, 999: reason }, [154]).overrides.map((o) => o.stringId)).toEqual([154]);
  });
});

describe('mapOverrideFieldErrors', () => {
  it('maps overrides.N.reason back to the string that was sent N-th', () => {
    const sent = [{ stringId: 154 }, { stringId: 155 }];
    expect(mapOverrideFieldErrors({ 'overrides.1.reason': 'Explain the override in at least 20 characters', comment: 'Too long' }, sent)).toEqual({
      byString: { 155: 'Explain the override in at least 20 characters' },
      other: { comment: 'Too long' },
    });
  });
});
