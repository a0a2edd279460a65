import { faultCategoryLabels, openStatuses, workOrderStatusLabels, type Metrics, type WorkOrderStatus } from '@stringfield/shared';

export type OpenByStatusRow = { status: WorkOrderStatus; label: string; count: number; averageAgeHours: number };

/** Every open state in workflow order, zero where the API has no row, so the chart never reshuffles. */
export function openByStatusRows(metrics: Pick<Metrics, 'openByStatus'>): OpenByStatusRow[] {
  const byStatus = new Map(metrics.openByStatus.map((o) => [o.status, o]));
  return openStatuses.map((status) => {
    const row = byStatus.get(status);
    return { status, label: workOrderStatusLabels[status], count: row?.count ?? 0, averageAgeHours: row?.averageAgeHours ?? 0 };
  });
}

export type MeanTimeRow = Metrics['meanTimes'][number] & { label: string };

/** Site × fault category rows labelled "FWM · Fuse", in the API's order (site, then category). */
export function meanTimeRows(metrics: Pick<Metrics, 'meanTimes'>): MeanTimeRow[] {
  return metrics.meanTimes.map((m) => ({ ...m, label: `${m.siteCode} · ${faultCategoryLabels[m.faultCategory]}` }));
}

export function topCategoryRows(metrics: Pick<Metrics, 'topFaultCategories'>) {
  return metrics.topFaultCategories.map((t) => ({ ...t, label: faultCategoryLabels[t.faultCategory] }));
}

export function totalOpen(metrics: Pick<Metrics, 'openByStatus'>): number {
  return metrics.openByStatus.reduce((sum, o) => sum + o.count, 0);
}
