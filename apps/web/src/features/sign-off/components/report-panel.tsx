import { useState } from 'react';
import { Button, buttonClasses } from '@/components/ui/button';
import { Icon } from '@/components/ui/icon';
import { IS_REPORT_FRAMEABLE, reportFileName, reportUrl } from '../lib/report';

/**
 * The close-out report: open it, download it, and (for staff before sign-off) look at the
 * PREVIEW-watermarked draft right on the page, with a download link if the browser cannot show PDFs.
 */
export function ReportPanel({ workOrderId, workOrderNumber, isSignedOff, canPreview }: { workOrderId: number; workOrderNumber: string; isSignedOff: boolean; canPreview: boolean }) {
  const [isPreviewOpen, setIsPreviewOpen] = useState(false);
  const url = reportUrl(workOrderId);
  return (
    <div className="flex flex-col gap-3">
      <p className="text-base text-ink-muted">
        {isSignedOff
          ? 'The signed report: evidence, checks, diode records and the sign-off digest.'
          : 'Until sign-off the report is a draft marked PREVIEW; the owner gets the signed one.'}
      </p>
      <div className="flex flex-col gap-2 sm:flex-row sm:flex-wrap">
        <a href={url} target="_blank" rel="noreferrer" className={buttonClasses({ variant: isSignedOff ? 'primary' : 'secondary' })}>
          <Icon name="file" /> {isSignedOff ? 'Close-out report (PDF)' : 'Open the preview (PDF)'}
          <span className="sr-only"> (opens in a new tab)</span>
        </a>
        <a href={url} download={reportFileName(workOrderNumber)} className={buttonClasses({ variant: 'ghost' })}>
          <Icon name="arrowRight" className="rotate-90" /> Download
        </a>
        {canPreview && !isSignedOff && IS_REPORT_FRAMEABLE ? (
          <Button variant="ghost" aria-expanded={isPreviewOpen} onClick={() => setIsPreviewOpen((v) => !v)}>
            <Icon name={isPreviewOpen ? 'chevronUp' : 'chevronDown'} /> {isPreviewOpen ? 'Hide the preview' : 'Show the preview here'}
          </Button>
        ) : null}
      </div>
      {isPreviewOpen ? (
        <iframe src={url} title={`Preview of the close-out report of ${workOrderNumber}`} className="h-[70dvh] w-full rounded-control border border-line bg-sunken" />
      ) : null}
      {canPreview && !isSignedOff && isPreviewOpen ? (
        <p className="text-sm text-ink-muted">
          No preview above? Your browser does not show PDFs here:{' '}
          <a href={url} download={reportFileName(workOrderNumber)} className="font-semibold text-brand underline underline-offset-4">
            download the preview
          </a>
          .
        </p>
      ) : null}
    </div>
  );
}
