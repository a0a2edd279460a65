import { describe, expect, it } from 'vitest';
import { withDeletableMeta } from './mariadb-connector.ts';

/** Rows as connector 3.1 and later return them: `meta` defined without `configurable`. */
function connectorRows(): Array<{ id: number }> {
  const rows = [{ id: 1 }, { id: 2 }];
  Object.defineProperty(rows, 'meta', { value: [{ name: 'id' }], writable: true, enumerable: false });
  return rows;
}

/** The result as Sequelize sees it: an object with a `meta` to take away. */
const withMeta = (rows: unknown) => rows as { meta?: unknown };

describe('withDeletableMeta', () => {
  it("lets Sequelize delete a result's meta, which the connector's own result refuses", () => {
    const original = withMeta(connectorRows());
    expect(() => {
      delete original.meta;
    }).toThrow(TypeError);

    const rows = withDeletableMeta(connectorRows());
    expect(withMeta(rows).meta).toEqual([{ name: 'id' }]);
    delete withMeta(rows).meta;
    expect(withMeta(rows).meta).toBeUndefined();
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
