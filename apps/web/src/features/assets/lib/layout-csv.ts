import { layoutCsvColumns, requiredLayoutCsvColumns } from '@stringfield/shared';

/** The header row of a layout CSV, exactly as the importer expects it. */
export const layoutCsvHeader = layoutCsvColumns.join(',');

/** Words for each column, for the sample and the preview table. */
export const layoutColumnLabels: Record<(typeof layoutCsvColumns)[number], string> = {
  label: 'Label',
  inverter: 'Inverter',
  mppt_input: 'MPPT input',
  combiner: 'Combiner',
  position: 'Position',
  module_model: 'Module model',
  modules_in_series: 'Modules in series',
  strings_in_parallel: 'Strings in parallel',
};

export function isRequiredColumn(column: string): boolean {
  return (requiredLayoutCsvColumns as readonly string[]).includes(column);
}

/**
 * An example file for this site: two inputs of its first inverter, the second one through a
 * combiner box, so a dispatcher sees every column filled in once.
 */
export function exampleLayoutCsv(options: { inverterTag: string; moduleModel: string; combinerTag?: string; modulesInSeries?: number }): string {
  const { inverterTag, moduleModel, combinerTag = '', modulesInSeries = 26 } = options;
  const rows = [
    [`${inverterTag}-MPPT1-S1`, inverterTag, '1', '', '', moduleModel, String(modulesInSeries), '2'],
    [`${inverterTag}-MPPT1-S2`, inverterTag, '1', '', '', moduleModel, String(modulesInSeries), '2'],
    [`${inverterTag}-MPPT2-S1`, inverterTag, '2', combinerTag, combinerTag ? '1' : '', moduleModel, String(modulesInSeries), '1'],
  ];
  return [layoutCsvHeader, ...rows.map((r) => r.map(csvCell).join(','))].join('\r\n') + '\r\n';
}

function csvCell(value: string): string {
  return /[",\r\n]/.test(value) ? `"${value.replace(/"/g, '""')}"` : value;
}

/** "1.2 MB", "640 kB", "900 B". */
export function formatBytes(bytes: number): string {
  if (bytes >= 1_000_000) return `${(bytes / 1_000_000).toFixed(1)} MB`;
  if (bytes >= 1000) return `${Math.round(bytes / 1000)} kB`;
  return `${bytes} B`;
}
