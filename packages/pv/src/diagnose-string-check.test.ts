import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { diagnoseStringCheck, type StringCheckInput } from './diagnose-string-check.ts';
import { buildModule } from './test-fixtures.ts';

const module = buildModule();
const stc = { irradianceWm2: 1000, moduleTempC: 25 };
/** A 20-module string of the published 60-cell module; STC Voc 766 V (20 × 38.3 V, pvlib test_fit_desoto datasheet). */
const check = (measured: StringCheckInput['measured'], extra: Partial<StringCheckInput> = {}) =>
  diagnoseStringCheck({ module, modulesInSeries: 20, measured, ...extra });
const codes = (r: ReturnType<typeof check>) => r.findings.map((f) => f.code);
const isOneSentence = (message: string) =>
  message.endsWith('.') && message.replace(/\d\.\d/g, '').split('. ').length === 1;

describe('diagnoseStringCheck', () => {
  it('passes a string reading its expected 766.0 V and 9.43 A at STC (datasheet × 20)', () => {
    const r = check({ vocV: 766, iscA: 9.43, ...stc });
    expect(r.verdict).toBe('pass');
    expect(r.findings).toEqual([]);
    expect(r.vocDeviationPct).toBeCloseTo(0, 9);
  });

  it('passes at 800 W/m² and 45 °C when Voc is the §1.1 value 20 × 35.1635 V (pv-field-testing §11 item 8)', () => {
    expect(check({ vocV: 20 * 35.1635, iscA: 7.6345, irradianceWm2: 800, moduleTempC: 45 }).verdict).toBe(
      'pass',
    );
  });

  it('flags reverse polarity on a negative Voc and tells the technician to stop (IEC 62446-1 polarity test 6.2)', () => {
    const r = check({ vocV: -765.2, ...stc });
    expect(r.verdict).toBe('fail');
    expect(codes(r)).toEqual(['REVERSE_POLARITY']);
    expect(r.findings[0]?.message).toMatch(/stop, do not connect the string or close its fuse or switch/);
    expect(r.findings[0]?.message).toMatch(/-765\.2 V/);
  });

  it('flags an open circuit when Voc is below 5 % of expected (pv-field-testing §7, common practice)', () => {
    const r = check({ vocV: 0.4, ...stc });
    expect(codes(r)).toEqual(['OPEN_CIRCUIT']);
    expect(r.findings[0]?.message).toMatch(/0\.4 V where about 766\.0 V/);
  });

  it('flags an open current path when Isc is 0 A with Voc present (pv-field-testing §7)', () => {
    const r = check({ vocV: 766, iscA: 0, ...stc });
    expect(codes(r)).toContain('OPEN_CIRCUIT');
    expect(r.verdict).toBe('fail');
  });

  it('flags one missing or shorted module when Voc is 38.3 V short (pv-field-testing §11 item 23)', () => {
    const r = check({ vocV: 766 - 38.3, iscA: 9.4, ...stc });
    expect(codes(r)).toEqual(['MODULES_MISSING_OR_SHORTED']);
    expect(r.findings[0]?.detail['modules']).toBe(1);
    expect(r.findings[0]?.message).toMatch(/38\.3 V \(5\.0 %\) below the 766\.0 V expected/);
  });

  it('flags two modules missing, or one reversed, when Voc is 76.6 V short (pv-field-testing §11 item 23)', () => {
    const r = check({ vocV: 766 - 76.6, ...stc });
    expect(r.findings[0]?.detail['modules']).toBe(2);
    expect(r.findings[0]?.message).toMatch(/reverse/);
  });

  it('flags one bypassed substring when Voc is 12.77 V short (38.3 V ÷ 3 diodes, pv-field-testing §11 item 23)', () => {
    const r = check({ vocV: 766 - 12.77, iscA: 9.42, ...stc });
    expect(codes(r)).toEqual(['SUBSTRINGS_BYPASSED']);
    expect(r.findings[0]?.detail['substrings']).toBe(1);
    expect(r.findings[0]?.message).toMatch(
      /12\.8 V \(1\.7 %\) below the 766\.0 V expected: about one substring/,
    );
  });

  it.each([
    // §11 item 23 arithmetic (12.77 V per substring at STC), 2 and 4 substrings
    { shortV: 2 * 12.77, substrings: 2 },
    { shortV: 4 * 12.77, substrings: 4 },
  ])(
    'flags $substrings bypassed substrings when Voc is $shortV V short (§11 item 23)',
    ({ shortV, substrings }) => {
      const r = check({ vocV: 766 - shortV, ...stc });
      expect(r.findings[0]?.code).toBe('SUBSTRINGS_BYPASSED');
      expect(r.findings[0]?.detail['substrings']).toBe(substrings);
    },
  );

  it('counts substrings at any conditions and string length (property: ΔV = j × module Voc ÷ 3)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 8, max: 30 }),
        fc.double({ min: 400, max: 1100, noNaN: true }),
        fc.double({ min: 5, max: 65, noNaN: true }),
        fc.integer({ min: 1, max: 5 }).filter((j) => j % 3 !== 0),
        fc.double({ min: -0.2, max: 0.2, noNaN: true }),
        (n, g, t, j, noise) => {
          const healthy = diagnoseStringCheck({
            module,
            modulesInSeries: n,
            measured: { vocV: 1, irradianceWm2: g, moduleTempC: t },
          }).expected;
          const vocV = healthy?.vocV ?? 0;
          const substringV = vocV / n / 3;
          const r = diagnoseStringCheck({
            module,
            modulesInSeries: n,
            measured: { vocV: vocV - (j + noise) * substringV, irradianceWm2: g, moduleTempC: t },
          });
          expect(r.findings.map((f) => f.code)).toContain('SUBSTRINGS_BYPASSED');
          expect(r.findings.find((f) => f.code === 'SUBSTRINGS_BYPASSED')?.detail['substrings']).toBe(j);
        },
      ),
    );
  });

  it('passes readings within a third of a substring of expected (property: no false counting, §7)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 8, max: 30 }),
        fc.double({ min: -0.25, max: 0.25, noNaN: true }),
        (n, noise) => {
          const vocV = n * 38.3 * (1 + noise / (3 * n));
          expect(
            diagnoseStringCheck({ module, modulesInSeries: n, measured: { vocV, ...stc } }).verdict,
          ).toBe('pass');
        },
      ),
    );
  });

  it('flags low current with normal voltage: 8.40 A is 10.9 % below the 9.43 A expected (IEC 62446 5 % band)', () => {
    const r = check({ vocV: 766, iscA: 8.4, ...stc });
    expect(codes(r)).toEqual(['LOW_CURRENT']);
    expect(r.findings[0]?.message).toMatch(/8\.40 A, 10\.9 % below the 9\.43 A expected while Voc is normal/);
    expect(r.iscDeviationPct).toBeCloseTo((8.4 / 9.43 - 1) * 100, 9);
  });

  it('flags one module more than documented when Voc is 38.3 V high (pv-field-testing §7)', () => {
    const r = check({ vocV: 766 + 38.3, ...stc });
    expect(codes(r)).toEqual(['VOLTAGE_HIGH']);
    expect(r.findings[0]?.detail['extraModules']).toBe(1);
  });

  it('flags a high voltage that is no whole module as a datasheet or temperature problem (7 % high)', () => {
    const r = check({ vocV: 766 * 1.07, ...stc });
    expect(codes(r)).toEqual(['VOLTAGE_HIGH']);
    expect(r.findings[0]?.message).toMatch(/datasheet/);
  });

  it('flags a low voltage that is no whole number of substrings (7.5 % = 4.5 substrings short)', () => {
    expect(codes(check({ vocV: 766 * 0.925, ...stc }))).toEqual(['VOLTAGE_LOW']);
  });

  it.each([
    // minimum irradiance for Voc 200 W/m² (common practice, no source)
    {
      name: 'too little sun',
      measured: { vocV: 766, irradianceWm2: 120, moduleTempC: 25 },
      needs: /200 W\/m²/,
    },
    // no module temperature: ±1 °C is ±0.36 % of Voc (pv-field-testing §7 sensitivity)
    {
      name: 'no module temperature',
      measured: { vocV: 766, irradianceWm2: 900 },
      needs: /back-of-module temperature/,
    },
    { name: 'no irradiance', measured: { vocV: 766, moduleTempC: 25 }, needs: /reference cell/ },
    // ±2 % stability (pv-field-testing §3.3, common practice)
    {
      name: 'unsteady sun',
      measured: { vocV: 766, irradianceWm2: 1000, moduleTempC: 25, irradianceSamplesWm2: [950, 1000, 1050] },
      needs: /±5\.0 %/,
    },
    // Isc needs 400 W/m² (IEC 62446-1 I-V test, from memory)
    {
      name: 'enough sun for Voc only',
      measured: { vocV: 20 * 36.1, iscA: 2.8, irradianceWm2: 300, moduleTempC: 25 },
      needs: /400 W\/m²/,
    },
  ])('says conditions are too poor with $name, and what is needed', ({ measured, needs }) => {
    const r = check(measured);
    expect(codes(r)).toContain('CONDITIONS_TOO_POOR');
    expect(r.verdict).not.toBe('pass');
    expect(r.findings.find((f) => f.code === 'CONDITIONS_TOO_POOR')?.message).toMatch(needs);
  });

  it('notes a reading that agrees with its peers but not with the datasheet (IEC 62446 5 % peer band, §11 item 26)', () => {
    const r = check(
      { vocV: 722, iscA: 9.4, ...stc },
      { peers: [{ vocV: 720 }, { vocV: 721 }, { vocV: 719 }] },
    );
    expect(codes(r)).toEqual(['PEERS_AGREE_DATASHEET_DISAGREES']);
    expect(r.verdict).toBe('attention');
  });

  it('notes peers agreeing on a current 10 % below the datasheet: suspect the irradiance sensor', () => {
    const r = check(
      { vocV: 766, iscA: 8.5, ...stc },
      {
        peers: [
          { vocV: 766, iscA: 8.45 },
          { vocV: 765, iscA: 8.52 },
        ],
      },
    );
    expect(codes(r)).toEqual(['PEERS_AGREE_DATASHEET_DISAGREES']);
    expect(r.findings[0]?.message).toMatch(/irradiance sensor/);
  });

  it('counts against the peer median when there are peers: 12.0 V below a 720.0 V median is one substring', () => {
    const r = check({ vocV: 708, ...stc }, { peers: [{ vocV: 720 }, { vocV: 721 }, { vocV: 719 }] });
    const finding = r.findings.find((f) => f.code === 'SUBSTRINGS_BYPASSED');
    expect(finding?.detail['reference']).toBe('peers');
    expect(finding?.message).toMatch(/720\.0 V median of the other strings/);
  });

  it('writes every message as one sentence with numbers and units', () => {
    const readings = [
      { vocV: -766, ...stc },
      { vocV: 0.2, ...stc },
      { vocV: 727.7, iscA: 9.4, ...stc },
      { vocV: 753.2, ...stc },
      { vocV: 766, iscA: 8.4, ...stc },
      { vocV: 804.3, ...stc },
      { vocV: 766, irradianceWm2: 100, moduleTempC: 25 },
    ];
    for (const measured of readings) {
      for (const f of check(measured).findings) {
        expect(isOneSentence(f.message)).toBe(true);
        expect(f.message).toMatch(/\d+(\.\d+)? (V|A|W\/m²|%)/);
        expect(f.confidence).toBeGreaterThanOrEqual(0);
        expect(f.confidence).toBeLessThanOrEqual(1);
      }
    }
  });

  it('lets a site tighten the Voc band: 4.2 % low (2.5 substrings, no count) passes at 5 % and fails at 3 % (configurable tolerances)', () => {
    expect(check({ vocV: 766 * 0.958, ...stc }).verdict).toBe('pass');
    expect(codes(check({ vocV: 766 * 0.958, ...stc }, { tolerance: { vocPct: 3 } }))).toEqual([
      'VOLTAGE_LOW',
    ]);
  });

  it('records the engine version with the verdict', () => {
    expect(check({ vocV: 766, ...stc }).engineVersion).toMatch(/^\d+\.\d+\.\d+$/);
  });

  it('throws on a non-finite Voc (programmer error)', () => {
    expect(() => check({ vocV: Number.NaN, ...stc })).toThrow(RangeError);
  });
});
