import { describe, expect, it } from 'vitest';
import { classifyThermalAnomaly } from './classify-thermal-anomaly.ts';

describe('classifyThermalAnomaly (IEC TS 62446-3 classes of abnormality)', () => {
  it.each([
    // ΔT thresholds 10 K / 20 K: common practice, no source (pv-field-testing §8)
    { deltaTC: 5, irradianceWm2: 1000, coa: 1 },
    { deltaTC: 12, irradianceWm2: 1000, coa: 2 },
    { deltaTC: 25, irradianceWm2: 1000, coa: 3 },
    // scaled ΔT·1000/G: 8 K at 700 W/m² is 11.4 K at 1000 W/m² (common practice, no source)
    { deltaTC: 8, irradianceWm2: 700, coa: 2 },
    { deltaTC: 15, irradianceWm2: 700, coa: 3 },
  ])('puts ΔT $deltaTC K at $irradianceWm2 W/m² in CoA $coa', ({ deltaTC, irradianceWm2, coa }) => {
    expect(classifyThermalAnomaly({ deltaTC, irradianceWm2 }).classOfAbnormality).toBe(coa);
  });

  it('refuses to judge below 600 W/m² and says what is needed (IEC TS 62446-3, §11 item 28)', () => {
    const r = classifyThermalAnomaly({ deltaTC: 30, irradianceWm2: 550 });
    expect(r.isConditionsTooPoor).toBe(true);
    expect(r.classOfAbnormality).toBeNull();
    expect(r.reason).toMatch(/600 W\/m²/);
  });

  it('calls a 6.9 K warm substring CoA 2, the ΔT a dead cell-string makes at 1000 W/m² (§11 item 24 [derived])', () => {
    expect(
      classifyThermalAnomaly({ deltaTC: 6.9, irradianceWm2: 1000, pattern: 'warm-substring' })
        .classOfAbnormality,
    ).toBe(2);
  });

  it('calls a 12 K hot connector safety-relevant, CoA 3 (fire risk; common practice, no source)', () => {
    expect(
      classifyThermalAnomaly({ deltaTC: 12, irradianceWm2: 1000, pattern: 'hot-connector' })
        .classOfAbnormality,
    ).toBe(3);
  });

  it('calls any spot at 105 °C CoA 3 (backsheet/encapsulant limit ≈ 100–120 °C, common practice)', () => {
    expect(classifyThermalAnomaly({ deltaTC: 4, irradianceWm2: 900, maxTempC: 105 }).classOfAbnormality).toBe(
      3,
    );
  });

  it('lets a site move the thresholds (configurable, as the sheet asks)', () => {
    expect(
      classifyThermalAnomaly({ deltaTC: 12, irradianceWm2: 1000, thresholds: { coa2DeltaTC: 15 } })
        .classOfAbnormality,
    ).toBe(1);
  });

  it('gives the reason as one sentence with the numbers', () => {
    const { reason } = classifyThermalAnomaly({ deltaTC: 8, irradianceWm2: 700 });
    expect(reason).toMatch(/8\.0 K at 700 W\/m² \(11\.4 K at 1000 W\/m²\)/);
    expect(reason.endsWith('.')).toBe(true);
    expect(reason.replace(/\d\.\d/g, '').split('. ')).toHaveLength(1);
  });
});
