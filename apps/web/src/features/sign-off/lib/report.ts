import { apiUrl } from '@/lib/api-client';

/** The close-out report of a ticket (inline PDF; watermarked PREVIEW before sign-off). */
export function reportUrl(workOrderId: number): string {
  return apiUrl(`/api/work-orders/${workOrderId}/report.pdf`);
}

/**
 * Whether the API lets the ticket page frame the PDF. It does not yet: every answer carries
 * `frame-ancestors 'none'`, so an embedded preview shows "refused to connect". Until report.pdf is
 * sent with `frame-ancestors 'self'` the preview opens in a new tab; then flip this.
 */
export const IS_REPORT_FRAMEABLE = true;

/** The file name the API gives the report, for the download attribute. */
export function reportFileName(workOrderNumber: string): string {
  return `${workOrderNumber}-close-out.pdf`;
}

/** A short digest for reading aloud or comparing by eye: the first and last 8 hex digits. */
export function shortDigest(digest: string): string {
  return digest.length > 20 ? `${digest.slice(0, 8)}…${digest.slice(-8)}` : digest;
}
