import { describe, expect, it } from 'vitest';
import { withDeletableMeta } from './db.ts';

/** Rows as connector 3.1 and later return them: `meta` defined without `configurable`. */
function connectorRows() {
  const rows = [{ id: 1 }, { id: 2 }];
  Object.defineProperty(rows, 'meta', { value: [{ name: 'id' }], writable: true, enumerable: false });
  return rows as typeof rows & { meta?: unknown };
}

describe('withDeletableMeta', () => {
  it("lets Sequelize delete a result's meta, which the connector's own result refuses", () => {
    const original = connectorRows();
    expect(() => {
      'use strict';
      delete original.meta;
    }).toThrow(TypeError);

    const rows = withDeletableMeta(connectorRows());
    const meta = rows.meta;
    expect(meta).toEqual([{ name: 'id' }]);
    delete rows.meta;
    expect(rows.meta).toBeUndefined();
    expect(rows).toEqual([{ id: 1 }, { id: 2 }]);
    expect(Object.keys(rows)).toEqual(['0', '1']);
  });

  it('hands back anything else as it is: an insert result, rows whose meta may be deleted already', () => {
    const insert = { affectedRows: 1, insertId: 7 };
    expect(withDeletableMeta(insert)).toBe(insert);
    const rows = Object.assign([{ id: 1 }], { meta: [] });
    expect(withDeletableMeta(rows)).toBe(rows);
  });
});
