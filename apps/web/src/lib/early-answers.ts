import type { QueryKey } from '@tanstack/react-query';

/**
 * Answers asked for while the app is still starting (who is signed in, the first page's data: see
 * app/first-page.ts), so that they travel alongside the page's code instead of after React has rendered
 * it. The query that mounts later takes the answer over instead of asking again (`answeredEarly`).
 *
 * An answer is taken once and kept for a short while only: a page opened much later asks afresh.
 */
const KEEP_MS = 10_000;
const started = new Map<string, { answer: Promise<unknown>; at: number }>();

/**
 * A query key as text, the way TanStack Query's `hashKey` makes it (plain objects with their keys in
 * order), so that a key matches however its object was built. Not imported: this module is part of the
 * app's first script, which would then carry the query core as well.
 */
export function keyText(queryKey: QueryKey): string {
  return JSON.stringify(queryKey, (_, value: unknown) =>
    isPlainObject(value)
      ? Object.fromEntries(Object.keys(value).sort().map((key) => [key, value[key]]))
      : value,
  );
}

function isPlainObject(value: unknown): value is Record<string, unknown> {
  if (Object.prototype.toString.call(value) !== '[object Object]') return false;
  const proto = Object.getPrototypeOf(value) as unknown;
  return proto === null || proto === Object.prototype;
}

// Keys a query has asked for itself (or taken an early answer for) in this page: nothing early is started
// for them any more, whatever came first (a kept copy can draw the page before the person is known).
const asked = new Set<string>();

export function startEarly(queryKey: QueryKey, ask: () => Promise<unknown>): void {
  const key = keyText(queryKey);
  if (asked.has(key)) return;
  const answer = ask();
  // Handled by the query that takes it over; not an unhandled rejection meanwhile.
  answer.catch(() => undefined);
  started.set(key, { answer, at: Date.now() });
}

/** The early answer for `queryKey` without taking it (the query still will). */
export function peekEarly<T>(queryKey: QueryKey): Promise<T> | undefined {
  const entry = started.get(keyText(queryKey));
  return entry && Date.now() - entry.at <= KEEP_MS ? (entry.answer as Promise<T>) : undefined;
}

/**
 * Takes the early answer for `queryKey`, if there is one still good for `state`: not when the cached data
 * is newer than the question (written since, by a mutation), nor when the query was invalidated (something
 * changed on the server since: a queued check sent, say).
 */
export function takeEarly<T>(queryKey: QueryKey, state?: { dataUpdatedAt: number; isInvalidated: boolean }): Promise<T> | undefined {
  const key = keyText(queryKey);
  const entry = started.get(key);
  started.delete(key);
  asked.add(key);
  if (!entry || Date.now() - entry.at > KEEP_MS) return undefined;
  if (state && (state.isInvalidated || state.dataUpdatedAt > entry.at)) return undefined;
  return entry.answer as Promise<T>;
}

type AskContext = {
  queryKey: QueryKey;
  signal: AbortSignal;
  client?: { getQueryState(queryKey: QueryKey): { dataUpdatedAt: number; isInvalidated: boolean } | undefined };
};

/**
 * The same query options, whose query function takes an early answer for the key when there is one still
 * good (see takeEarly) and asks otherwise.
 */
export function answeredEarly<O extends { queryKey: QueryKey; queryFn?: unknown }>(options: O): O {
  const ask = options.queryFn as (context: AskContext) => Promise<unknown>;
  return {
    ...options,
    queryFn: (context: AskContext) => takeEarly(context.queryKey, context.client?.getQueryState(context.queryKey)) ?? ask(context),
  };
}

/** Forgets every early answer and every key asked for: the person changed (sign-in, sign-out, a lost session), or a test. */
export function clearEarlyAnswers(): void {
  started.clear();
  asked.clear();
}
