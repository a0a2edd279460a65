import { sizingCheckLabels } from '@stringfield/shared';
import { Badge } from '@/components/ui/badge';

/** A string's sizing verdict in words: "Sizing ok", or "Fails" with the name of every failing check. */
export function SizingBadge({ failures, isCompact = false }: { failures: readonly string[]; isCompact?: boolean }) {
  if (failures.length === 0) return <Badge tone="pass">Sizing ok</Badge>;
  return (
    <div className="flex flex-col items-end gap-1 md:items-start">
      <Badge tone="fail">
        Fails {failures.length} {failures.length === 1 ? 'check' : 'checks'}
      </Badge>
      {isCompact ? null : (
        <ul className="text-right text-sm text-ink md:text-left">
          {failures.map((code) => (
            <li key={code}>
              <span className="sr-only">Not met: </span>
              {sizingCheckLabels[code] ?? code}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
