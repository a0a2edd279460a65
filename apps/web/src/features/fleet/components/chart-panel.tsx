import { Suspense, useId, useState, type ReactNode } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { LoadingRegion, Skeleton } from '@/components/ui/skeleton';

/**
 * A chart with its numbers one press away. The chart is a picture for sighted readers (role="img"
 * with a one-line summary); the table beside it, with a caption, is the same data for everyone.
 */
export function ChartPanel({
  title,
  description,
  summary,
  chart,
  table,
  isEmpty = false,
  emptyText,
  chartHeight = 260,
}: {
  title: string;
  description?: ReactNode;
  /** What the chart shows, in one sentence, for assistive technology. */
  summary: string;
  chart: ReactNode;
  table: ReactNode;
  isEmpty?: boolean;
  emptyText?: string;
  chartHeight?: number;
}) {
  const [isTable, setIsTable] = useState(false);
  const headingId = useId();
  return (
    <Card className="flex min-w-0 flex-col p-4 sm:p-5">
      <section aria-labelledby={headingId} className="flex min-w-0 flex-col">
        <div className="mb-3 flex flex-wrap items-start justify-between gap-2">
          <div className="min-w-0">
            <h2 id={headingId} className="text-lg font-semibold">
              {title}
            </h2>
            {description ? <p className="text-sm text-ink-muted">{description}</p> : null}
          </div>
          {isEmpty ? null : (
            <Button variant="secondary" aria-pressed={isTable} onClick={() => setIsTable((v) => !v)} className="shrink-0">
              {isTable ? 'Show as chart' : 'Show as table'}
            </Button>
          )}
        </div>
        {isEmpty ? (
          <p className="rounded-control border-2 border-dashed border-edge/60 px-4 py-8 text-center text-ink-muted">{emptyText ?? 'Nothing in this period.'}</p>
        ) : isTable ? (
          <div className="overflow-x-auto">{table}</div>
        ) : (
          <div role="img" aria-label={summary} style={{ height: chartHeight }} className="min-w-0">
            <Suspense
              fallback={
                <LoadingRegion label="Loading the chart" className="h-full">
                  <Skeleton className="h-full" />
                </LoadingRegion>
              }
            >
              {chart}
            </Suspense>
          </div>
        )}
      </section>
    </Card>
  );
}

/** A plain data table with a caption, for the "Show as table" side of a chart. */
export function FigureTable({ caption, headers, rows, alignRightFrom = 1 }: { caption: string; headers: string[]; rows: ReactNode[][]; alignRightFrom?: number }) {
  return (
    <table className="w-full border-collapse text-left">
      <caption className="mb-2 text-left text-sm font-semibold text-ink-muted">{caption}</caption>
      <thead>
        <tr className="border-b-2 border-edge/50">
          {headers.map((h, k) => (
            <th key={h} scope="col" className={k >= alignRightFrom ? 'px-2 py-2 text-right text-sm font-semibold' : 'px-2 py-2 text-sm font-semibold'}>
              {h}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {rows.map((cells, r) => (
          <tr key={r} className="border-b border-line last:border-b-0">
            {cells.map((c, k) =>
              k === 0 ? (
                <th key={k} scope="row" className="px-2 py-2 font-medium">
                  {c}
                </th>
              ) : (
                <td key={k} className={k >= alignRightFrom ? 'readings px-2 py-2 text-right' : 'px-2 py-2'}>
                  {c}
                </td>
              ),
            )}
          </tr>
        ))}
      </tbody>
    </table>
  );
}
