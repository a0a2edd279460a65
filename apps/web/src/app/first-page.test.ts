import { beforeEach, describe, expect, it, vi } from 'vitest';

vi.mock('@/lib/warm-up-intl', () => ({ warmUpIntl: vi.fn() }));

const { warmUpIntl } = await import('@/lib/warm-up-intl');
const { prepareFirstPage } = await import('./first-page');

describe('prepareFirstPage', () => {
  beforeEach(() => vi.mocked(warmUpIntl).mockClear());

  it.each(['/', '/work-orders', '/work-orders/', '/work-orders/12/field'])(
    'loads the locale data at start-up for %s, whose first render formats deadlines or readings',
    (pathname) => {
      prepareFirstPage({ pathname, search: '' });
      expect(warmUpIntl).toHaveBeenCalledTimes(1);
    },
  );

  it.each(['/sign-in', '/sites', '/work-orders/12', '/fleet'])('leaves it to first use on %s', (pathname) => {
    prepareFirstPage({ pathname, search: '' });
    expect(warmUpIntl).not.toHaveBeenCalled();
  });
});
