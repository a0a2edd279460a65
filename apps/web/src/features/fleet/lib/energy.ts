import type { EnergyAtRiskItem } from '@stringfield/shared';

export const energySorts = ['missingW', 'dailyKWh', 'number'] as const;
export type EnergySort = (typeof energySorts)[number];

/** Biggest first for power and energy; ticket numbers in ascending order. Stable on ticket number. */
export function sortEnergyItems(items: readonly EnergyAtRiskItem[], sort: EnergySort): EnergyAtRiskItem[] {
  const byNumber = (a: EnergyAtRiskItem, b: EnergyAtRiskItem) => a.number.localeCompare(b.number, 'en', { numeric: true });
  return [...items].sort((a, b) => {
    if (sort === 'number') return byNumber(a, b);
    return b[sort] - a[sort] || byNumber(a, b);
  });
}

export function parseEnergySort(value: string | null): EnergySort {
  return (energySorts as readonly string[]).includes(value ?? '') ? (value as EnergySort) : 'missingW';
}

/** Totals per site code, for the overview cards. */
export function energyBySite(items: readonly EnergyAtRiskItem[]): Map<string, { tickets: number; missingW: number; dailyKWh: number }> {
  const totals = new Map<string, { tickets: number; missingW: number; dailyKWh: number }>();
  for (const item of items) {
    const t = totals.get(item.siteCode) ?? { tickets: 0, missingW: 0, dailyKWh: 0 };
    t.tickets += 1;
    t.missingW += item.missingW;
    t.dailyKWh += item.dailyKWh;
    totals.set(item.siteCode, t);
  }
  return totals;
}
