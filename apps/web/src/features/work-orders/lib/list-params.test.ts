import { openStatuses } from '@stringfield/shared';
import { describe, expect, it } from 'vitest';
import {
  defaultWorkOrderListParams,
  hasWorkOrderFilters,
  parseWorkOrderListParams,
  sortingFromParam,
  sortParamFromSorting,
  workOrderListQuery,
  workOrderListSearch,
} from './list-params';

const parse = (search: string, role?: Parameters<typeof parseWorkOrderListParams>[1]) =>
  parseWorkOrderListParams(new URLSearchParams(search), role);

describe('board filters in the URL', () => {
  it('starts a dispatcher on the open tickets, soonest deadline first', () => {
    const params = parse('', 'dispatcher');
    expect(params.status).toEqual(openStatuses);
    expect(params.sort).toBe('dueAt');
    expect(workOrderListSearch(params, 'dispatcher')).toEqual(
      Object.fromEntries(Object.keys(workOrderListSearch(params)).map((k) => [k, undefined])),
    );
  });

  it('starts an owner on every status, newest first', () => {
    expect(parse('', 'owner')).toMatchObject({ status: [], sort: '-reportedAt' });
  });

  it('reads a saved view of overdue unassigned P1 and P2 tickets at one site', () => {
    const params = parse(
      'status=reported,dispatched&priority=P2,P1&siteId=3&assigneeId=none&overdue=true&q=INV07&sort=-priority&page=2',
    );
    expect(params).toEqual({
      status: ['reported', 'dispatched'],
      priority: ['P1', 'P2'],
      siteId: 3,
      assigneeId: 'none',
      faultCategory: undefined,
      isOverdueOnly: true,
      q: 'INV07',
      sort: '-priority',
      page: 2,
      pageSize: 25,
    });
  });

  it('round-trips a view through the URL', () => {
    const view = {
      ...defaultWorkOrderListParams('dispatcher'),
      status: ['in_field' as const],
      assigneeId: 7,
      faultCategory: 'fuse' as const,
      page: 3,
    };
    const search = new URLSearchParams(
      Object.entries(workOrderListSearch(view, 'dispatcher'))
        .filter(([, v]) => v !== undefined)
        .map(([k, v]) => [k, String(v)]),
    );
    expect(parse(search.toString(), 'dispatcher')).toEqual(view);
  });

  it('writes "every status" as status=all when the default is narrower', () => {
    const every = { ...defaultWorkOrderListParams('dispatcher'), status: [] };
    expect(workOrderListSearch(every, 'dispatcher').status).toBe('all');
    expect(parse('status=all', 'dispatcher').status).toEqual([]);
    expect(workOrderListQuery(every).status).toBeUndefined();
  });

  it('drops values a hand-edited link got wrong, one by one', () => {
    const params = parse(
      'status=reported,bogus&priority=P9&siteId=abc&assigneeId=someone&faultCategory=gremlins&sort=colour&page=-1&pageSize=5000',
      'dispatcher',
    );
    expect(params).toMatchObject({
      status: ['reported'],
      priority: [],
      siteId: undefined,
      assigneeId: undefined,
      faultCategory: undefined,
      sort: 'dueAt',
      page: 1,
      pageSize: 25,
    });
  });

  it('falls back to the default statuses when none of the listed ones exist', () => {
    expect(parse('status=bogus', 'supervisor').status).toEqual(openStatuses);
  });

  it('tells a filtered board from the starting one', () => {
    expect(hasWorkOrderFilters(parse('', 'dispatcher'), 'dispatcher')).toBe(false);
    expect(hasWorkOrderFilters(parse('assigneeId=me'), 'technician')).toBe(true);
    expect(hasWorkOrderFilters(parse('sort=-number'), 'dispatcher')).toBe(false);
  });

  it('asks the API for the same filters', () => {
    expect(workOrderListQuery(parse('priority=P1&assigneeId=me&overdue=true'))).toMatchObject({
      priority: 'P1',
      assigneeId: 'me',
      overdue: 'true',
      sort: 'dueAt',
      page: 1,
    });
  });
});

describe('sorting', () => {
  it('maps the URL sort to the table header state and back', () => {
    expect(sortingFromParam('-dueAt')).toEqual([{ id: 'dueAt', desc: true }]);
    expect(sortParamFromSorting([{ id: 'priority', desc: false }])).toBe('priority');
    expect(sortParamFromSorting([{ id: 'assignee', desc: false }])).toBe('dueAt');
  });
});
