import type { EnergyAtRiskItem } from '@stringfield/shared';
import { describe, expect, it } from 'vitest';
import { energyBySite, parseEnergySort, sortEnergyItems } from './energy';

const item = (overrides: Partial<EnergyAtRiskItem>): EnergyAtRiskItem => ({
  workOrderId: 1,
  number: 'WO-2026-00001',
  siteCode: 'FWM',
  missingW: 1000,
  dailyKWh: 4.5,
  peakSunHours: 4.5,
  basis: 'no check yet: the whole string is counted',
  ...overrides,
});

describe('energy at risk', () => {
  const items = [
    item({ workOrderId: 1, number: 'WO-2026-00010', missingW: 5000, dailyKWh: 22.5 }),
    item({ workOrderId: 2, number: 'WO-2026-00002', siteCode: 'OSR', missingW: 4000, dailyKWh: 24, peakSunHours: 6 }),
    item({ workOrderId: 3, number: 'WO-2026-00003', missingW: 5000, dailyKWh: 22.5 }),
  ];

  it('puts the largest missing power first, ties by ticket number', () => {
    expect(sortEnergyItems(items, 'missingW').map((i) => i.workOrderId)).toEqual([3, 1, 2]);
  });

  it('can rank by daily energy instead, where a sunnier site climbs', () => {
    expect(sortEnergyItems(items, 'dailyKWh').map((i) => i.workOrderId)).toEqual([2, 3, 1]);
  });

  it('reads an unknown sort from the URL as missing power', () => {
    expect(parseEnergySort('bogus')).toBe('missingW');
    expect(parseEnergySort('dailyKWh')).toBe('dailyKWh');
  });

  it('totals tickets, watts and kWh per site', () => {
    expect(energyBySite(items).get('FWM')).toEqual({ tickets: 2, missingW: 10000, dailyKWh: 45 });
  });
});
