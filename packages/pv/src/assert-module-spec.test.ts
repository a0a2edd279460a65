import { describe, expect, it } from 'vitest';
import { assertModuleSpec } from './assert-module-spec.ts';
import { buildModule } from './test-fixtures.ts';

describe('assertModuleSpec', () => {
  it('accepts the published 60-cell datasheet (pvlib test_fit_desoto)', () => {
    expect(() => assertModuleSpec(buildModule())).not.toThrow();
  });

  it.each([
    { name: 'Imp above Isc', overrides: { impA: 9.5 } },
    { name: 'a positive beta', overrides: { betaVocPctPerC: 0.3 } },
    { name: '60 cells over 7 diodes', overrides: { bypassDiodes: 7 } },
    { name: 'half a cell', overrides: { cellsInSeries: 60.5 } },
  ])('rejects $name', ({ overrides }) => {
    expect(() => assertModuleSpec(buildModule(overrides))).toThrow(RangeError);
  });
});
