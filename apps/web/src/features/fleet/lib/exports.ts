import { exportQuerySchema } from '@stringfield/shared';
import { apiUrl } from '@/lib/api-client';

export const exportKinds = [
  {
    name: 'tickets',
    title: 'Tickets',
    contains: 'One row per ticket reported in the period: number, status, priority, fault category, title, the times it was reported, due, dispatched, repaired and signed off, returns, assignee and strings.',
  },
  {
    name: 'checks',
    title: 'String checks',
    contains: 'One row per check taken in the period: ticket, string, phase, technician, measured and expected Voc and Isc with conditions, deviations, verdict, findings, insulation and whether it was superseded.',
  },
  {
    name: 'diode-replacements',
    title: 'Diode replacements',
    contains: 'One row per bypass diode replaced in the period: ticket, string, module position and serial, diode position, failure mode, how it was found, part fitted, forward voltage and Voc before and after.',
  },
] as const;
export type ExportName = (typeof exportKinds)[number]['name'];

/** The download URL of an export, or the reason there is none yet (no site, bad range). */
export function exportHref(name: ExportName, query: { siteId: number | undefined; from: string; to: string }): { href: string } | { error: string } {
  const parsed = exportQuerySchema.safeParse(query);
  if (!parsed.success) return { error: parsed.error.issues[0]?.message ?? 'Choose a site and a period' };
  return { href: apiUrl(`/api/fleet/exports/${name}.csv`, { siteId: parsed.data.siteId, from: parsed.data.from, to: parsed.data.to }) };
}
