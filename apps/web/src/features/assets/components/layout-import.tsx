import type { ImportPreview, Site } from '@stringfield/shared';
import { useEffect, useId, useMemo, useRef, useState } from 'react';
import { toast } from '@/lib/toast';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Icon } from '@/components/ui/icon';
import { ImportRejectedError, useImportLayout, type UploadProgress } from '../api/import-layout';
import { exampleLayoutCsv, formatBytes, layoutCsvHeader } from '../lib/layout-csv';
import { ImportPreviewTable, importLineId } from './import-preview-table';

const MAX_BYTES = 10 * 1024 * 1024;

/**
 * Layout import in two steps: check the file (dry run, nothing changes), then import every row in
 * one go. A file with errors can be fixed and picked again without leaving the page.
 */
export function LayoutImport({
  site,
  example,
  onCommitted,
}: {
  site: Site;
  example: { inverterTag: string; moduleModel: string; combinerTag?: string };
  onCommitted: (preview: ImportPreview) => void;
}) {
  const upload = useImportLayout(site.id);
  const inputId = useId();
  const summaryId = useId();
  const inputRef = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<ImportPreview | null>(null);
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const [mode, setMode] = useState<'dry-run' | 'commit'>('dry-run');
  const [message, setMessage] = useState<{ tone: 'fail' | 'attention'; text: string } | null>(null);
  const [isProblemsOnly, setIsProblemsOnly] = useState(false);

  const { inverterTag, moduleModel, combinerTag } = example;
  const exampleHref = useMemo(
    () => URL.createObjectURL(new Blob([exampleLayoutCsv({ inverterTag, moduleModel, combinerTag })], { type: 'text/csv' })),
    [inverterTag, moduleModel, combinerTag],
  );
  useEffect(() => () => URL.revokeObjectURL(exampleHref), [exampleHref]);

  const send = (chosen: File, nextMode: 'dry-run' | 'commit') => {
    setMode(nextMode);
    setMessage(null);
    setProgress({ loadedBytes: 0, totalBytes: chosen.size });
    upload.mutate(
      { file: chosen, mode: nextMode, onProgress: setProgress },
      {
        onSuccess: (result) => {
          setPreview(result);
          if (result.committed) {
            toast.success(`${result.validRows} ${result.validRows === 1 ? 'string' : 'strings'} imported into ${site.code}`);
            onCommitted(result);
          }
        },
        onError: (error) => {
          if (error instanceof ImportRejectedError) {
            setPreview(error.preview);
            setMessage({ tone: 'fail', text: error.message });
          } else {
            setMessage({ tone: 'fail', text: error.message });
          }
        },
        onSettled: () => setProgress(null),
      },
    );
  };

  const pick = (chosen: File | undefined) => {
    // Clear the input so picking the same (now corrected) file again still fires a change.
    if (inputRef.current) inputRef.current.value = '';
    if (!chosen) return;
    setPreview(null);
    setIsProblemsOnly(false);
    if (chosen.size > MAX_BYTES) {
      setFile(null);
      setMessage({ tone: 'fail', text: `${chosen.name} is ${formatBytes(chosen.size)}; the limit is 10 MB. Split it into smaller files.` });
      return;
    }
    setFile(chosen);
    send(chosen, 'dry-run');
  };

  const canCommit = Boolean(file && preview && !preview.committed && preview.fileErrors.length === 0 && preview.errorRows === 0 && preview.validRows > 0 && !upload.isPending);
  const rows = preview ? (isProblemsOnly ? preview.rows.filter((r) => r.errors.length > 0 || r.warnings.length > 0) : preview.rows) : [];
  const percent = progress?.totalBytes ? Math.round((progress.loadedBytes / progress.totalBytes) * 100) : undefined;

  return (
    <div className="flex flex-col gap-6">
      <Card className="p-4 sm:p-5">
        <h2 className="text-lg font-semibold">1. Prepare the file</h2>
        <p className="mt-1 max-w-prose text-ink-muted">
          One row per string, comma- or semicolon-separated, with this first row. Combiner, position and strings in parallel may stay empty. Inverters, combiner boxes and
          module models must exist before the import.
        </p>
        <pre className="readings mt-3 overflow-x-auto rounded-control border border-line bg-sunken p-3 font-mono text-sm">{layoutCsvHeader}</pre>
        <a
          href={exampleHref}
          download={`${site.code.toLowerCase()}-layout-example.csv`}
          className="mt-3 inline-flex min-h-touch items-center gap-2 font-semibold text-brand underline underline-offset-4"
        >
          <Icon name="file" /> Download an example for {site.code}
        </a>
      </Card>

      <Card className="p-4 sm:p-5">
        <h2 className="text-lg font-semibold">2. Check the file</h2>
        <p className="mt-1 text-ink-muted">Nothing is imported yet: every row is checked against {site.code} first.</p>
        <div className="mt-4 flex flex-wrap items-center gap-3">
          <input ref={inputRef} id={inputId} type="file" accept=".csv,text/csv" className="sr-only" onChange={(event) => pick(event.target.files?.[0])} />
          <label
            htmlFor={inputId}
            className="inline-flex min-h-touch cursor-pointer items-center gap-2 rounded-control border-2 border-edge bg-surface px-4 font-semibold hover:bg-sunken focus-within:outline-3"
          >
            <Icon name="file" />
            {file ? 'Choose another file' : 'Choose a CSV file'}
          </label>
          {file ? (
            <span className="text-ink-muted">
              <span className="font-semibold text-ink">{file.name}</span> · {formatBytes(file.size)}
            </span>
          ) : null}
          {file && !upload.isPending ? (
            <Button variant="ghost" onClick={() => send(file, 'dry-run')}>
              <Icon name="refresh" /> Check again
            </Button>
          ) : null}
        </div>

        <div aria-live="polite" className="mt-4 empty:hidden">
          {upload.isPending ? (
            <div className="flex flex-col gap-2">
              <label className="font-semibold" htmlFor={`${inputId}-progress`}>
                {mode === 'commit' ? 'Importing' : 'Checking'} {file?.name}…{' '}
                {percent !== undefined && percent < 100 ? `${percent} % uploaded` : 'reading the rows'}
              </label>
              <progress id={`${inputId}-progress`} className="h-3 w-full accent-brand" max={100} value={percent ?? undefined} />
            </div>
          ) : null}
        </div>
        <div aria-live="assertive" className="mt-4 empty:hidden">
          {message ? <Alert tone={message.tone}>{message.text}</Alert> : null}
        </div>
      </Card>

      {preview ? (
        <section aria-labelledby="preview-heading" className="flex flex-col gap-4">
          <h2 id="preview-heading" className="text-lg font-semibold">
            3. Review and import
          </h2>
          {preview.fileErrors.length > 0 ? (
            <Alert tone="fail" title="The file could not be checked">
              <ul className="list-disc pl-5">
                {preview.fileErrors.map((e) => (
                  <li key={e}>{e}</li>
                ))}
              </ul>
            </Alert>
          ) : (
            <>
              {/* Each figure is named by its term, so it can be found (and read out) by what it counts, not where it sits. */}
              <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4" aria-live="polite" aria-label={`Check of ${file?.name ?? 'the file'}`}>
                {[
                  ['rows', 'Rows', preview.totalRows, 'text-ink'],
                  ['ready', 'Ready', preview.validRows, 'text-pass'],
                  ['errors', 'With errors', preview.errorRows, preview.errorRows ? 'text-fail' : 'text-ink'],
                  ['warnings', 'With warnings', preview.warningRows, preview.warningRows ? 'text-attention' : 'text-ink'],
                ].map(([key, label, value, colour]) => (
                  <div key={String(key)} className="rounded-card border border-line bg-surface px-4 py-3 shadow-card">
                    <dt id={`${summaryId}-${String(key)}`} className="text-sm text-ink-muted">
                      {label}
                    </dt>
                    <dd aria-labelledby={`${summaryId}-${String(key)}`} className={`readings text-2xl font-bold ${String(colour)}`}>
                      {value}
                    </dd>
                  </div>
                ))}
              </dl>
              {preview.errorRows > 0 ? (
                <Alert tone="fail" title={`${preview.errorRows} ${preview.errorRows === 1 ? 'row has' : 'rows have'} errors: nothing can be imported yet`}>
                  Fix the marked cells in your spreadsheet, save the CSV and choose it again. Rows are imported all together or not at all.
                  <LineLinks label="Go to" lines={preview.rows.filter((r) => r.errors.length > 0).map((r) => r.line)} />
                </Alert>
              ) : preview.warningRows > 0 ? (
                <Alert tone="attention" title="Warnings do not stop the import">
                  Read them before you import: they point at strings that will fail a sizing check.
                  <LineLinks label="Go to" lines={preview.rows.filter((r) => r.warnings.length > 0).map((r) => r.line)} />
                </Alert>
              ) : null}
              <div className="flex flex-wrap items-center justify-between gap-3">
                <label className="inline-flex min-h-touch cursor-pointer items-center gap-3 font-semibold">
                  <input type="checkbox" className="size-6 accent-brand" checked={isProblemsOnly} onChange={(e) => setIsProblemsOnly(e.target.checked)} />
                  Only rows with errors or warnings
                </label>
                <Button variant="primary" size="lg" disabled={!canCommit} isPending={upload.isPending && mode === 'commit'} onClick={() => file && send(file, 'commit')}>
                  Import {preview.validRows} {preview.validRows === 1 ? 'string' : 'strings'}
                </Button>
              </div>
              <ImportPreviewTable rows={rows} caption={`Rows of ${file?.name ?? 'the file'}`} />
            </>
          )}
        </section>
      ) : null}
    </div>
  );
}

/** The file lines an alert is about, each a link to its row in the table below (first 20). */
function LineLinks({ label, lines }: { label: string; lines: number[] }) {
  if (lines.length === 0) return null;
  const shown = lines.slice(0, 20);
  return (
    <span className="mt-1 block">
      {label}:{' '}
      {shown.map((line, index) => (
        <span key={line}>
          {index > 0 ? ', ' : null}
          <a href={`#${importLineId(line)}`} className="inline-block py-1.5 font-semibold underline underline-offset-4">
            line {line}
          </a>
        </span>
      ))}
      {lines.length > shown.length ? ` and ${lines.length - shown.length} more` : null}.
    </span>
  );
}
