import type { StringCheck } from '@stringfield/shared';
import { describe, expect, it } from 'vitest';
import { ApiError } from '@/lib/api-client';
import type { QueueStore } from '@/lib/offline-queue';
import { classifySendError, createCheckQueue, requestPathOf, type QueuedCheck } from './check-queue';
import { buildCheckInput, buildStringCheck } from './test-factories';

function memoryStore(): QueueStore {
  const data = new Map<string, unknown>();
  return { get: (k) => Promise.resolve(data.get(k)), set: (k, v) => Promise.resolve(void data.set(k, v)) };
}

const item = (overrides: Partial<QueuedCheck> = {}): QueuedCheck => ({
  kind: 'check',
  workOrderId: 16,
  workOrderNumber: 'WO-2026-00016',
  stringLabel: 'INV03-MPPT4-S1',
  input: buildCheckInput(),
  previewVerdict: 'fail',
  ...overrides,
});

describe('requestPathOf', () => {
  it('posts a new reading to its ticket and a correction to the check it corrects', () => {
    expect(requestPathOf(item())).toBe('/api/work-orders/16/checks');
    expect(requestPathOf(item({ kind: 'revision', correctsCheckId: 41 }))).toBe('/api/checks/41/revisions');
  });
});

describe('classifySendError', () => {
  it('retries when there was no answer at all', () => {
    expect(classifySendError(new ApiError({ status: 0, code: 'NETWORK', message: 'offline' })).kind).toBe('retry');
  });

  it('retries a busy or broken server', () => {
    expect(classifySendError(new ApiError({ status: 503, code: 'UNAVAILABLE', message: 'Briefly unavailable.' })).kind).toBe('retry');
  });

  it('holds a 409 with the server message and the ticket status it sent', () => {
    const error = new ApiError({
      status: 409,
      code: 'CONFLICT',
      message: 'WO-2026-00016 is not in the field right now.',
      body: { error: {}, status: 'returned' },
    });
    expect(classifySendError(error)).toMatchObject({
      kind: 'hold',
      status: 409,
      reason: 'WO-2026-00016 is not in the field right now. The ticket is now “Returned”.',
    });
  });

  it('holds a 403 (the ticket was reassigned)', () => {
    expect(classifySendError(new ApiError({ status: 403, code: 'FORBIDDEN', message: 'Only the technician assigned records its checks.' })).kind).toBe('hold');
  });

  it('waits for sign-in on a 401 instead of hammering the server', () => {
    expect(classifySendError(new ApiError({ status: 401, code: 'UNAUTHENTICATED', message: 'Sign in' })).kind).toBe('stop');
  });
});

describe('createCheckQueue', () => {
  it('sends the reading with its clientId, so a retry after a lost answer is the same check', async () => {
    const bodies: unknown[] = [];
    let answers = 0;
    const post = (_path: string, body: unknown): Promise<StringCheck> => {
      bodies.push(body);
      answers += 1;
      // The first answer is lost on the way back; the server had saved it.
      if (answers === 1) return Promise.reject(new ApiError({ status: 0, code: 'NETWORK', message: 'offline' }));
      return Promise.resolve(buildStringCheck({ id: 77 }));
    };
    const queue = createCheckQueue({ userId: 3, store: memoryStore(), post, isOnline: () => true });
    const first = await queue.submit('6f1c2a52-8d8e-4b8e-9a55-0c7a2b7d9e01', item());
    expect(first.kind).toBe('waiting');
    await queue.flush();
    expect(bodies).toHaveLength(2);
    expect(bodies.map((b) => (b as { clientId: string }).clientId)).toEqual(['6f1c2a52-8d8e-4b8e-9a55-0c7a2b7d9e01', '6f1c2a52-8d8e-4b8e-9a55-0c7a2b7d9e01']);
    expect(queue.getSnapshot().entries).toEqual([]);
    queue.dispose();
  });
});
