import type { Gate } from '@stringfield/shared';

/** The API's minimum; a shorter reason does not lift the gate. */
export const MIN_OVERRIDE_REASON_CHARS = 20;
export const MAX_OVERRIDE_REASON_CHARS = 2000;

/** What the live counter under an override reason says. */
export function overrideReasonStatus(reason: string): { count: number; isValid: boolean; isEmpty: boolean; text: string } {
  const count = reason.trim().length;
  const isEmpty = count === 0;
  const isValid = count >= MIN_OVERRIDE_REASON_CHARS && count <= MAX_OVERRIDE_REASON_CHARS;
  const text = isEmpty
    ? `At least ${MIN_OVERRIDE_REASON_CHARS} characters`
    : count < MIN_OVERRIDE_REASON_CHARS
      ? `${count} of ${MIN_OVERRIDE_REASON_CHARS} characters — ${MIN_OVERRIDE_REASON_CHARS - count} more`
      : count > MAX_OVERRIDE_REASON_CHARS
        ? `${count} characters — at most ${MAX_OVERRIDE_REASON_CHARS}`
        : `${count} characters ✓`;
  return { count, isValid, isEmpty, text };
}

/** The strings whose after-check the supervisor may override (a check exists but did not pass). */
export function overridableItems(gates: readonly Gate[]): Array<{ stringId: number; message: string }> {
  const out: Array<{ stringId: number; message: string }> = [];
  for (const g of gates)
    for (const m of g.missing) if (m.overridable && m.stringId !== null && !out.some((o) => o.stringId === m.stringId)) out.push({ stringId: m.stringId, message: m.message });
  return out;
}

/**
 * The overrides to send, from the reasons typed per string. Blank reasons are left out (no
 * override); a reason that is too short is an error beside its field rather than a silent drop.
 * Reasons for strings no longer overridable are ignored.
 */
export function buildOverrides(
  reasons: Readonly<Record<number, string>>,
  overridableStringIds: readonly number[],
): { overrides: Array<{ stringId: number; reason: string }>; errors: Record<number, string> } {
  const overrides: Array<{ stringId: number; reason: string }> = [];
  const errors: Record<number, string> = {};
  for (const stringId of overridableStringIds) {
    const reason = (reasons[stringId] ?? '').trim();
    if (!reason) continue;
    const status = overrideReasonStatus(reason);
    if (!status.isValid) {
      errors[stringId] =
        status.count < MIN_OVERRIDE_REASON_CHARS ? `Explain the override in at least ${MIN_OVERRIDE_REASON_CHARS} characters` : `Use at most ${MAX_OVERRIDE_REASON_CHARS} characters`;
      continue;
    }
    overrides.push({ stringId, reason });
  }
  return { overrides, errors };
}

/**
 * Maps the server's field errors (`overrides.0.reason`) back to the string they belong to, using
 * the list that was sent. Other fields are returned as they came.
 */
export function mapOverrideFieldErrors(
  fields: Readonly<Record<string, string>>,
  sent: ReadonlyArray<{ stringId: number }>,
): { byString: Record<number, string>; other: Record<string, string> } {
  const byString: Record<number, string> = {};
  const other: Record<string, string> = {};
  for (const [key, message] of Object.entries(fields)) {
    const match = /^overrides\.(\d+)(\.|$)/.exec(key);
    const target = match ? sent[Number(match[1])] : undefined;
    if (target) byString[target.stringId] ??= message;
    else other[key] = message;
  }
  return { byString, other };
}
