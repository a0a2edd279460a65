import { describe, expect, it } from 'vitest';
import { exampleLayoutCsv, formatBytes, isRequiredColumn, layoutCsvHeader } from './layout-csv';

describe('exampleLayoutCsv', () => {
  it('starts with the header the importer reads and fills every column once', () => {
    const csv = exampleLayoutCsv({ inverterTag: 'INV01', moduleModel: 'SDM-405-72M', combinerTag: 'CB-01A' });
    const lines = csv.trimEnd().split('\r\n');
    expect(lines[0]).toBe('label,inverter,mppt_input,combiner,position,module_model,modules_in_series,strings_in_parallel');
    expect(lines[0]).toBe(layoutCsvHeader);
    expect(lines[3]).toBe('INV01-MPPT2-S1,INV01,2,CB-01A,1,SDM-405-72M,26,1');
  });

  it('quotes a model name that holds a comma', () => {
    expect(exampleLayoutCsv({ inverterTag: 'INV01', moduleModel: 'Maker, 405 W' })).toContain('"Maker, 405 W"');
  });
});

describe('layout columns', () => {
  it('requires label, inverter, input, module model and modules in series only', () => {
    expect(['label', 'combiner', 'strings_in_parallel'].map(isRequiredColumn)).toEqual([true, false, false]);
  });
});

describe('formatBytes', () => {
  it.each([
    [900, '900 B'],
    [640_000, '640 kB'],
    [1_234_567, '1.2 MB'],
  ])('writes %i bytes as %s', (bytes, text) => {
    expect(formatBytes(bytes)).toBe(text);
  });
});
