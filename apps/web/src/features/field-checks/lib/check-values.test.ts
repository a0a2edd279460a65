import { stringCheckInputSchema } from '@stringfield/shared';
import { describe, expect, it } from 'vitest';
import { checkToFormValues, emptyCheckValues, parseDecimal, previousConditions, toCheckPayload } from './check-values';
import { buildCheckInput, buildStringCheck } from './test-factories';

describe('parseDecimal', () => {
  it.each([
    ['1151.5', 1151.5],
    ['1151,5', 1151.5],
    ['  812 ', 812],
    ['-1167.1', -1167.1],
    ['−1167.1', -1167.1],
    ['+8.2', 8.2],
    ['.5', 0.5],
    ['12.', 12],
  ])('reads %j as %d', (text, value) => {
    expect(parseDecimal(text)).toBe(value);
  });

  it('treats a blank field as not measured', () => {
    expect(parseDecimal('')).toBeUndefined();
    expect(parseDecimal('   ')).toBeUndefined();
  });

  it('turns text that is not a number into NaN so the schema names the field', () => {
    expect(parseDecimal('12V')).toBeNaN();
    expect(parseDecimal('1.2.3')).toBeNaN();
    const result = stringCheckInputSchema.safeParse({ ...buildCheckInput(), vocV: parseDecimal('abc') });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.message).toBe('Voc must be a number in V');
  });

  it('asks for a required reading left blank, rather than calling it not a number', () => {
    const result = stringCheckInputSchema.safeParse({ ...buildCheckInput(), vocV: parseDecimal('') });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.message).toBe('Enter the Voc in V');
  });
});

describe('toCheckPayload', () => {
  const now = new Date('2026-12-01T18:45:00.000Z');

  it('stamps a new reading with the time it is saved', () => {
    expect(toCheckPayload(buildCheckInput(), { isCorrection: false, now }).takenAt).toBe('2026-12-01T18:45:00.000Z');
  });

  it('keeps the original time on a correction', () => {
    expect(toCheckPayload(buildCheckInput(), { isCorrection: true, now }).takenAt).toBe('2026-12-01T18:30:00.000Z');
  });

  it('leaves out what was not measured and lists each instrument once', () => {
    const payload = toCheckPayload(buildCheckInput({ iscA: undefined, instrumentIds: [2, 2, 5], notes: '  fuse ok  ' }), { isCorrection: false, now });
    expect('iscA' in payload).toBe(false);
    expect(payload.instrumentIds).toEqual([2, 5]);
    expect(payload.notes).toBe('fuse ok');
    expect(stringCheckInputSchema.safeParse(payload).success).toBe(true);
  });

  it('keeps a negative Voc: that is how reversed polarity shows', () => {
    expect(toCheckPayload(buildCheckInput({ vocV: -1167.1, polarityCorrect: false }), { isCorrection: false, now }).vocV).toBe(-1167.1);
  });
});

describe('checkToFormValues', () => {
  it('pre-fills a correction with the saved reading, a new client id and the original time', () => {
    const values = checkToFormValues(buildStringCheck(), 'new-id');
    expect(values).toMatchObject({ clientId: 'new-id', stringId: 661, takenAt: '2026-12-01T18:00:00.000Z', vocV: 1151.5, ambientC: 18, instrumentIds: [2] });
    expect(values.operatingCurrentA).toBeUndefined();
  });

  it('validates against the shared schema once the new id is a UUID', () => {
    const values = checkToFormValues(buildStringCheck(), '3b2f8f5e-7c1d-4d63-9e0a-2f4b6c8d0e12');
    expect(stringCheckInputSchema.safeParse(values).success).toBe(true);
  });
});

describe('emptyCheckValues', () => {
  it('asks for polarity and phase rather than guessing them', () => {
    const values = emptyCheckValues({ clientId: 'x', stringId: 661, takenAt: '2026-12-01T18:00:00.000Z' });
    expect(values.polarityCorrect).toBeUndefined();
    expect(values.phase).toBeUndefined();
  });
});

describe('previousConditions', () => {
  it('copies from the most recent reading, a queued one included', () => {
    const saved = [buildStringCheck({ takenAt: '2026-12-01T18:00:00.000Z', irradianceWm2: 780 })];
    const queued = [buildCheckInput({ takenAt: '2026-12-01T18:20:00.000Z', irradianceWm2: 812, moduleTempC: 46 })];
    expect(previousConditions(saved, queued, 3)?.conditions).toMatchObject({ irradianceWm2: 812, moduleTempC: 46 });
  });

  it('ignores other technicians, corrected readings and readings without conditions', () => {
    const saved = [
      buildStringCheck({ technician: { id: 9, name: 'Someone else' }, takenAt: '2026-12-01T19:00:00.000Z' }),
      buildStringCheck({ supersededById: 7, takenAt: '2026-12-01T18:50:00.000Z' }),
      buildStringCheck({ irradianceWm2: null, moduleTempC: null, ambientC: null, takenAt: '2026-12-01T18:40:00.000Z' }),
      buildStringCheck({ irradianceWm2: 640, takenAt: '2026-12-01T18:10:00.000Z' }),
    ];
    expect(previousConditions(saved, [], 3)?.conditions.irradianceWm2).toBe(640);
  });

  it('offers nothing on the first check of the day', () => {
    expect(previousConditions([], [], 3)).toBeNull();
  });
});
