import { describe, expect, it } from 'vitest';
import { maxStringVoc } from './max-string-voc.ts';
import { buildModule } from './test-fixtures.ts';

describe('maxStringVoc (NEC 690.7(A))', () => {
  const module = buildModule();
  it('coefficient method: 20 × 38.3 V, β −0.36 %/K, −10 °C → factor 1.12600, 862.52 V (pv-field-testing §11 item 18)', () => {
    const r = maxStringVoc({ module, modulesInSeries: 20, lowestAmbientC: -10, method: 'coefficient' });
    expect(r.correctionFactor).toBeCloseTo(1.126, 6);
    expect(r.maxVocV).toBeCloseTo(862.52, 2);
  });

  it('table method: the same string at −10 °C → 873.24 V (pv-field-testing §11 item 18)', () => {
    expect(
      maxStringVoc({ module, modulesInSeries: 20, lowestAmbientC: -10, method: 'table' }).maxVocV,
    ).toBeCloseTo(873.24, 2);
  });

  it('never corrects below the rated Voc on a warm site (NEC 690.7 corrects for cold only)', () => {
    expect(
      maxStringVoc({ module, modulesInSeries: 20, lowestAmbientC: 30, method: 'coefficient' }).maxVocV,
    ).toBeCloseTo(766, 9);
  });
});
