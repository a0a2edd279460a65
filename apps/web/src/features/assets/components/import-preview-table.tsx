import { layoutCsvColumns, type ImportPreview } from '@stringfield/shared';
import { Fragment } from 'react';
import { Icon } from '@/components/ui/icon';
import { cn } from '@/lib/cn';
import { layoutColumnLabels } from '../lib/layout-csv';

type Row = ImportPreview['rows'][number];

/** The id of a file line's row, for links from the summary above the table. */
export function importLineId(line: number): string {
  return `import-line-${line}`;
}

/** Every checked CSV line: values by column, the cell with a problem marked and its message beside it. */
export function ImportPreviewTable({ rows, caption }: { rows: Row[]; caption: string }) {
  const extraColumns = [...new Set(rows.flatMap((r) => [...r.errors, ...r.warnings].map((p) => p.column)))].filter(
    (c) => !(layoutCsvColumns as readonly string[]).includes(c),
  );
  const columns = [...layoutCsvColumns, ...extraColumns];

  return (
    // A region that scrolls sideways must take focus so a keyboard can scroll it (WCAG 2.1.1).
    // eslint-disable-next-line jsx-a11y/no-noninteractive-tabindex
    <div className="overflow-x-auto rounded-card border border-line bg-surface shadow-card" tabIndex={0} role="region" aria-label={`${caption}, scrolls sideways`}>
      <table className="w-full min-w-[56rem] border-collapse text-left">
        <caption className="sr-only">{caption}</caption>
        <thead className="bg-sunken text-sm text-ink-muted">
          <tr>
            <th scope="col" className="sticky left-0 z-10 bg-sunken px-3 py-2 font-semibold">
              Line
            </th>
            <th scope="col" className="px-3 py-2 font-semibold">
              Status
            </th>
            {columns.map((c) => (
              <th key={c} scope="col" className="px-3 py-2 font-semibold">
                {layoutColumnLabels[c as keyof typeof layoutColumnLabels] ?? c}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => {
            const hasErrors = row.errors.length > 0;
            const rowErrors = row.errors.filter((e) => !columns.includes(e.column));
            return (
              <Fragment key={row.line}>
                <tr id={importLineId(row.line)} className={cn('scroll-mt-24 border-t border-line', hasErrors && 'bg-fail-soft/40')}>
                  <th scope="row" className={cn('readings sticky left-0 z-10 px-3 py-2 align-top font-semibold', hasErrors ? 'bg-fail-soft' : 'bg-surface')}>
                    {row.line}
                  </th>
                  <td className="px-3 py-2 align-top whitespace-nowrap">
                    {hasErrors ? (
                      <span className="inline-flex items-center gap-1 font-semibold text-fail">
                        <Icon name="fail" /> {row.errors.length} {row.errors.length === 1 ? 'error' : 'errors'}
                      </span>
                    ) : row.warnings.length > 0 ? (
                      <span className="inline-flex items-center gap-1 font-semibold text-attention">
                        <Icon name="alert" /> Warning
                      </span>
                    ) : (
                      <span className="inline-flex items-center gap-1 font-semibold text-pass">
                        <Icon name="check" /> Ready
                      </span>
                    )}
                  </td>
                  {columns.map((c) => {
                    const errors = row.errors.filter((e) => e.column === c);
                    const warnings = row.warnings.filter((w) => w.column === c);
                    const value = row.values[c] ?? '';
                    return (
                      <td
                        key={c}
                        className={cn(
                          'max-w-[20rem] px-3 py-2 align-top',
                          (errors.length > 0 || warnings.length > 0) && 'min-w-[14rem]',
                          errors.length > 0 && 'border-2 border-fail bg-fail-soft',
                          errors.length === 0 && warnings.length > 0 && 'border-2 border-attention/60 bg-attention-soft',
                        )}
                      >
                        <span className={cn('readings font-mono', value === '' && 'text-ink-faint')}>{value === '' ? '–' : value}</span>
                        {errors.map((e) => (
                          <span key={e.message} className="mt-1 flex gap-1 text-sm font-medium text-fail">
                            <Icon name="fail" className="mt-0.5 size-4" />
                            <span>
                              <span className="sr-only">Error: </span>
                              {e.message}
                            </span>
                          </span>
                        ))}
                        {warnings.map((w) => (
                          <span key={w.message} className="mt-1 flex gap-1 text-sm text-attention">
                            <Icon name="alert" className="mt-0.5 size-4" />
                            <span>
                              <span className="sr-only">Warning: </span>
                              {w.message}
                            </span>
                          </span>
                        ))}
                      </td>
                    );
                  })}
                </tr>
                {rowErrors.length > 0 ? (
                  <tr className="bg-fail-soft/40">
                    <td />
                    <td colSpan={columns.length + 1} className="px-3 pb-2 text-sm font-medium text-fail">
                      {rowErrors.map((e) => e.message).join(' ')}
                    </td>
                  </tr>
                ) : null}
              </Fragment>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
