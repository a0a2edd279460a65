import { sizingCheckLabels } from '@stringfield/shared';

export type SizingFailureCount = { code: string; label: string; count: number };

/**
 * Counts, per named sizing check, how many strings fail it; most common first. Unknown codes keep
 * their code as the label so a new check on the server still shows up.
 */
export function countSizingFailures(strings: readonly { sizingFailures: readonly string[] }[]): SizingFailureCount[] {
  const counts = new Map<string, number>();
  for (const s of strings) for (const code of new Set(s.sizingFailures)) counts.set(code, (counts.get(code) ?? 0) + 1);
  return [...counts.entries()]
    .map(([code, count]) => ({ code, label: sizingCheckLabels[code] ?? code, count }))
    .sort((a, b) => b.count - a.count || a.label.localeCompare(b.label));
}

/** "24 of 192 strings fail at least one sizing check" / "All 600 strings pass every sizing check". */
export function sizingHeadline(failing: number, total: number): string {
  if (total === 0) return 'No strings registered yet';
  if (failing === 0) return total === 1 ? 'The one string passes every sizing check' : `All ${total} strings pass every sizing check`;
  return `${failing} of ${total} ${total === 1 ? 'string fails' : 'strings fail'} at least one sizing check`;
}
