import type { HealthCell } from '@stringfield/shared';
import { z } from 'zod';
import { cellVerdict, cellVerdicts, type CellVerdict } from './verdict-style';

/** The health map's filters as the URL holds them, so a dispatcher can send "INV07, fails only". */
export type MapParams = {
  verdict: CellVerdict | undefined;
  isOpenOnly: boolean;
  inverter: string | undefined;
  view: 'map' | 'list';
};

export const defaultMapParams: MapParams = { verdict: undefined, isOpenOnly: false, inverter: undefined, view: 'map' };

const verdictParam = z.enum(cellVerdicts as [CellVerdict, ...CellVerdict[]]);
const inverterParam = z.string().trim().min(1).max(40);

/** Reads the filters from the address bar; anything that does not parse is simply not applied. */
export function parseMapParams(search: URLSearchParams): MapParams {
  const verdict = verdictParam.safeParse(search.get('verdict') ?? undefined);
  const inverter = inverterParam.safeParse(search.get('inverter') ?? undefined);
  return {
    verdict: verdict.success ? verdict.data : undefined,
    isOpenOnly: search.get('open') === '1',
    inverter: inverter.success ? inverter.data : undefined,
    view: search.get('view') === 'list' ? 'list' : 'map',
  };
}

/** The URL search for a filter state; defaults left out so links stay short. */
export function mapSearch(params: MapParams): Record<string, string | undefined> {
  return {
    verdict: params.verdict,
    open: params.isOpenOnly ? '1' : undefined,
    inverter: params.inverter,
    view: params.view === 'map' ? undefined : params.view,
  };
}

/** Whether the verdict and open-ticket filters keep this string lit (the inverter filter hides whole rows instead). */
export function matchesCell(cell: HealthCell, params: Pick<MapParams, 'verdict' | 'isOpenOnly'>): boolean {
  if (params.verdict && cellVerdict(cell) !== params.verdict) return false;
  if (params.isOpenOnly && cell.openTickets === 0) return false;
  return true;
}

export function hasCellFilter(params: Pick<MapParams, 'verdict' | 'isOpenOnly'>): boolean {
  return params.verdict !== undefined || params.isOpenOnly;
}
