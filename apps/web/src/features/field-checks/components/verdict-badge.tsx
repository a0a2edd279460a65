import { Badge } from '@/components/ui/badge';
import { cn } from '@/lib/cn';
import type { Verdict } from '../lib/preview';
import { verdictLabels, verdictTones } from '../lib/verdict';

/** The verdict in words with its icon; `isLarge` for the result of a save. */
export function VerdictBadge({ verdict, isLarge = false, prefix }: { verdict: Verdict; isLarge?: boolean; prefix?: string }) {
  return (
    <Badge tone={verdictTones[verdict]} className={cn(isLarge && 'px-3 py-1 text-base')}>
      {prefix ? `${prefix} ` : null}
      {verdictLabels[verdict]}
    </Badge>
  );
}
