import { describe, expect, it } from 'vitest';
import * as pv from './index.ts';

describe('@stringfield/pv public interface', () => {
  it('exports an engine version in semver form so stored verdicts can name their engine', () => {
    expect(pv.ENGINE_VERSION).toMatch(/^\d+\.\d+\.\d+$/);
  });

  it('exports the finding codes as a closed list the API and web can branch on', () => {
    expect(pv.FINDING_CODES).toContain('SUBSTRINGS_BYPASSED');
    expect(new Set(pv.FINDING_CODES).size).toBe(pv.FINDING_CODES.length);
  });

  it('keeps the IEC 62446 5 % bands and the 600 W/m² thermography minimum as defaults (§11 items 26, 28)', () => {
    expect(pv.DEFAULT_TOLERANCES.stringCheck.peerPct).toBe(5);
    expect(pv.DEFAULT_TOLERANCES.thermal.minIrradianceWm2).toBe(600);
  });

  it.each([
    'cellTemperature',
    'expectedString',
    'necVoltageCorrectionFactor',
    'maxStringVoc',
    'checkStringSizing',
    'fitSingleDiode',
    'simulateString',
    'translateToStc',
    'analyzeCurve',
    'diagnoseStringCheck',
    'classifyThermalAnomaly',
    'insulationResistanceRequirement',
  ] as const)('exports %s', (name) => {
    expect(typeof pv[name]).toBe('function');
  });
});
