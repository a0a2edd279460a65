import { hashKey, QueryClient, queryOptions } from '@tanstack/react-query';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { answeredEarly, clearEarlyAnswers, keyText, peekEarly, startEarly, takeEarly } from './early-answers';

afterEach(() => {
  clearEarlyAnswers();
  vi.useRealTimers();
});

const ticketOptions = (ask: () => Promise<string>) =>
  answeredEarly(queryOptions({ queryKey: ['work-orders', 'detail', 7], queryFn: ask, retry: false }));

describe('early answers', () => {
  it('hands the answer to the query that mounts later, once, and asks again after that', async () => {
    const client = new QueryClient();
    const ask = vi.fn(() => Promise.resolve('asked by the query'));
    startEarly(['work-orders', 'detail', 7], () => Promise.resolve('asked early'));

    await expect(client.fetchQuery(ticketOptions(ask))).resolves.toBe('asked early');
    expect(ask).not.toHaveBeenCalled();

    await expect(client.fetchQuery({ ...ticketOptions(ask), staleTime: 0 })).resolves.toBe('asked by the query');
    expect(ask).toHaveBeenCalledTimes(1);
  });

  it('matches on the whole key: another ticket asks for itself', async () => {
    const client = new QueryClient();
    startEarly(['work-orders', 'detail', 8], () => Promise.resolve('ticket 8'));
    await expect(client.fetchQuery(ticketOptions(() => Promise.resolve('ticket 7')))).resolves.toBe('ticket 7');
    expect(peekEarly(['work-orders', 'detail', 8])).toBeDefined();
  });

  it('matches keys however the object in them is ordered, as the query cache does', () => {
    startEarly(['work-orders', 'list', { status: ['in_field'], page: 1 }], () => Promise.resolve('board'));
    expect(takeEarly(['work-orders', 'list', { page: 1, status: ['in_field'] }])).toBeDefined();
  });

  it('passes a failed early answer on to the query, without an unhandled rejection meanwhile', async () => {
    const client = new QueryClient();
    startEarly(['work-orders', 'detail', 7], () => Promise.reject(new Error('offline')));
    await new Promise((resolve) => setTimeout(resolve, 0));
    await expect(client.fetchQuery(ticketOptions(() => Promise.resolve('asked')))).rejects.toThrow('offline');
  });

  it('lets peek look without taking', () => {
    startEarly(['auth', 'me'], () => Promise.resolve(null));
    expect(peekEarly(['auth', 'me'])).toBeDefined();
    expect(takeEarly(['auth', 'me'])).toBeDefined();
    expect(takeEarly(['auth', 'me'])).toBeUndefined();
  });

  it('forgets an answer nobody took within ten seconds: a page opened later asks afresh', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    const client = new QueryClient();
    startEarly(['work-orders', 'detail', 7], () => Promise.resolve('stale'));
    vi.setSystemTime(Date.now() + 10_001);
    await expect(client.fetchQuery(ticketOptions(() => Promise.resolve('fresh')))).resolves.toBe('fresh');
  });

  it('starts nothing for a key a query has already asked for itself (a kept copy drew the page first)', async () => {
    const client = new QueryClient();
    await client.fetchQuery(ticketOptions(() => Promise.resolve('asked by the query')));
    const early = vi.fn(() => Promise.resolve('asked early'));
    startEarly(['work-orders', 'detail', 7], early);
    expect(early).not.toHaveBeenCalled();
    expect(peekEarly(['work-orders', 'detail', 7])).toBeUndefined();
  });

  it('passes over an early answer once the query was invalidated: something changed on the server since', async () => {
    const client = new QueryClient();
    client.setQueryData(['work-orders', 'detail', 7], 'kept copy');
    startEarly(['work-orders', 'detail', 7], () => Promise.resolve('asked before the change'));
    await client.invalidateQueries({ queryKey: ['work-orders', 'detail', 7], refetchType: 'none' });
    await expect(client.fetchQuery({ ...ticketOptions(() => Promise.resolve('asked after')), staleTime: 0 })).resolves.toBe('asked after');
  });

  it('passes over an early answer older than what the cache holds', async () => {
    vi.useFakeTimers({ toFake: ['Date'] });
    const client = new QueryClient();
    startEarly(['work-orders', 'detail', 7], () => Promise.resolve('asked early'));
    vi.setSystemTime(Date.now() + 1_000);
    client.setQueryData(['work-orders', 'detail', 7], 'written by a mutation since');
    await expect(client.fetchQuery({ ...ticketOptions(() => Promise.resolve('asked afresh')), staleTime: 0 })).resolves.toBe('asked afresh');
  });

  it('forgets which keys were asked for when the person changes', async () => {
    const client = new QueryClient();
    await client.fetchQuery(ticketOptions(() => Promise.resolve('first person')));
    clearEarlyAnswers();
    startEarly(['work-orders', 'detail', 7], () => Promise.resolve('next person, early'));
    expect(peekEarly(['work-orders', 'detail', 7])).toBeDefined();
  });

  // Reference: TanStack Query's own hashKey, which its query cache matches keys with.
  it.each([
    [['auth', 'me']],
    [['work-orders', 'detail', 7]],
    [['work-orders', 'list', { status: ['in_field', 'dispatched'], page: 1, q: '', siteId: undefined }]],
    [['x', { b: { d: 1, c: [{ f: null, e: 'é' }] }, a: true }]],
  ])('makes the same text of a key as TanStack Query: %j', (key) => {
    expect(keyText(key)).toBe(hashKey(key));
  });
});
