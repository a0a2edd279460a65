import type { SignOffRecord } from '@stringfield/shared';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Icon } from '@/components/ui/icon';
import { useVerifySignOff } from '../api/verify-sign-off';

function formatTime(iso: string, timeZone?: string): string {
  // dateStyle/timeStyle cannot be combined with timeZoneName, so the fields are spelled out.
  const options: Intl.DateTimeFormatOptions = { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', timeZoneName: 'short' };
  try {
    return new Intl.DateTimeFormat('en-GB', { ...options, timeZone }).format(new Date(iso));
  } catch {
    return new Intl.DateTimeFormat('en-GB', options).format(new Date(iso));
  }
}

/** Who signed off and when, the evidence digest, and a check that the evidence is still what was signed. */
export function SignOffRecordView({ record, timeZone }: { record: SignOffRecord; timeZone?: string }) {
  const verify = useVerifySignOff(record.workOrderId);
  return (
    <div className="flex flex-col gap-4">
      <dl className="grid gap-3 sm:grid-cols-2">
        <div>
          <dt className="text-sm text-ink-muted">Signed off by</dt>
          <dd className="text-lg font-semibold">{record.supervisor.name}</dd>
        </div>
        <div>
          <dt className="text-sm text-ink-muted">At</dt>
          <dd className="readings text-lg">{formatTime(record.signedAt, timeZone)}</dd>
        </div>
        <div className="sm:col-span-2">
          <dt className="text-sm text-ink-muted">Evidence digest (SHA-256)</dt>
          <dd className="readings font-mono text-sm break-all">{record.digest}</dd>
        </div>
        {record.comment ? (
          <div className="sm:col-span-2">
            <dt className="text-sm text-ink-muted">Comment</dt>
            <dd className="whitespace-pre-wrap [overflow-wrap:anywhere]">{record.comment}</dd>
          </div>
        ) : null}
        {record.overrides.length > 0 ? (
          <div className="sm:col-span-2">
            <dt className="text-sm text-ink-muted">Overrides</dt>
            <dd>
              <ul className="flex flex-col gap-1">
                {record.overrides.map((o) => (
                  <li key={o.stringId}>
                    <span className="readings font-semibold">{o.stringLabel}:</span> <span className="[overflow-wrap:anywhere]">{o.reason}</span>
                  </li>
                ))}
              </ul>
            </dd>
          </div>
        ) : null}
      </dl>
      <div className="flex flex-col gap-3">
        <Button variant="secondary" className="self-start" onClick={() => verify.mutate()} isPending={verify.isPending}>
          {verify.isPending ? null : <Icon name="shield" />} Verify evidence
        </Button>
        <div aria-live="polite">
          {verify.isError ? (
            <Alert tone="fail" title="The check did not run">
              {verify.error.message}
            </Alert>
          ) : verify.data ? (
            verify.data.matches ? (
              <Alert tone="pass" title="Evidence unchanged since sign-off">
                The digest of the evidence now matches the one stored at sign-off (checked {formatTime(verify.data.checkedAt, timeZone)}).
              </Alert>
            ) : (
              <Alert tone="fail" title="The evidence has changed since sign-off">
                <p>The digest computed now does not match the one stored at sign-off, so the photos, checks or records are not what the supervisor signed. Tell your administrator before relying on this report.</p>
                <p className="readings mt-1 font-mono text-sm break-all">Stored: {verify.data.storedDigest}</p>
                <p className="readings font-mono text-sm break-all">Now: {verify.data.computedDigest}</p>
              </Alert>
            )
          ) : null}
        </div>
      </div>
    </div>
  );
}
