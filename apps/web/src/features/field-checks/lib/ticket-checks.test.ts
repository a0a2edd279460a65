import { describe, expect, it } from 'vitest';
import { latestCurrentByString, mergeSavedCheck } from './ticket-checks';
import { buildStringCheck } from './test-factories';

describe('mergeSavedCheck', () => {
  it('adds a new check in time order', () => {
    const list = [buildStringCheck({ id: 1, takenAt: '2026-12-01T18:00:00.000Z' })];
    const merged = mergeSavedCheck(list, buildStringCheck({ id: 2, takenAt: '2026-12-01T17:00:00.000Z' }));
    expect(merged.map((c) => c.id)).toEqual([2, 1]);
  });

  it('marks the corrected check as superseded by its revision', () => {
    const list = [buildStringCheck({ id: 1 })];
    const merged = mergeSavedCheck(list, buildStringCheck({ id: 2, supersedesId: 1 }));
    expect(merged.find((c) => c.id === 1)?.supersededById).toBe(2);
  });

  it('does not duplicate a check the server returned twice (an idempotent repeat)', () => {
    const list = [buildStringCheck({ id: 1 })];
    expect(mergeSavedCheck(list, buildStringCheck({ id: 1 }))).toHaveLength(1);
  });
});

describe('latestCurrentByString', () => {
  it('takes the latest reading that has not been corrected', () => {
    const checks = [
      buildStringCheck({ id: 1, takenAt: '2026-12-01T17:00:00.000Z' }),
      buildStringCheck({ id: 2, takenAt: '2026-12-01T18:00:00.000Z', supersededById: 3 }),
      buildStringCheck({ id: 3, takenAt: '2026-12-01T18:00:00.000Z', supersedesId: 2 }),
      buildStringCheck({ id: 4, stringId: 662, takenAt: '2026-12-01T16:00:00.000Z' }),
    ];
    const latest = latestCurrentByString(checks);
    expect(latest.get(661)?.id).toBe(3);
    expect(latest.get(662)?.id).toBe(4);
  });
});
