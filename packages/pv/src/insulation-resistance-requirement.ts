import { assertNumber } from './assert-number.ts';

/** Result of {@link insulationResistanceRequirement}. */
export type InsulationRequirement = {
  /** DC test voltage, V. */
  readonly testVoltageV: number;
  /** Minimum insulation resistance, MΩ. */
  readonly minResistanceMOhm: number;
  /** Edition of the table used. */
  readonly edition: 'IEC 62446:2009' | 'IEC 62446-1:2016';
  /** What is and is not confirmed about these values. */
  readonly note: string;
};

type Row = { readonly upToV: number; readonly testVoltageV: number; readonly minResistanceMOhm: number };

// pv-field-testing §3.1 / §11 item 27; kept as data keyed by edition because AMD1:2018 revised the table.
const TABLES: Record<'2009' | '2016', readonly Row[]> = {
  '2009': [
    { upToV: 120, testVoltageV: 250, minResistanceMOhm: 0.5 },
    { upToV: 500, testVoltageV: 500, minResistanceMOhm: 1 },
    { upToV: Infinity, testVoltageV: 1000, minResistanceMOhm: 1 },
  ],
  '2016': [
    { upToV: 120, testVoltageV: 250, minResistanceMOhm: 0.5 },
    { upToV: 500, testVoltageV: 500, minResistanceMOhm: 1 },
    { upToV: 1000, testVoltageV: 1000, minResistanceMOhm: 1 },
    { upToV: Infinity, testVoltageV: 1500, minResistanceMOhm: 1 },
  ],
};

const NOTES = {
  '2009':
    'IEC 62446:2009 table: test voltages confirmed via a public summary, minimum resistances from memory; system voltage is Voc(STC) × 1.25; IEC 62446-1 AMD1:2018 revised the minima (possibly scaled with array size), which are not confirmed here, so local codes and the current edition rule.',
  '2016':
    'IEC 62446-1:2016 table as recalled (the > 1000 V row with a 1500 V test is from memory); system voltage is Voc(STC) × 1.25; AMD1:2018 revised the minima, which are not confirmed here, so local codes and the current edition rule.',
} as const;

/**
 * Insulation-resistance test voltage and minimum resistance for a PV array (IEC 62446, test 6.7;
 * pv-field-testing §3.1 and §11 item 27): system voltage < 120 V → 250 V test, 0.5 MΩ;
 * 120–500 V → 500 V, 1 MΩ; > 500 V → 1000 V, 1 MΩ (2009 edition, default). The 2016 edition adds
 * > 1000 V → 1500 V, 1 MΩ (from memory). `systemVoltageV` is Voc(STC) × 1.25 of the array, V (> 0).
 * Throws a RangeError on a non-positive voltage.
 */
export function insulationResistanceRequirement(
  systemVoltageV: number,
  edition: '2009' | '2016' = '2009',
): InsulationRequirement {
  assertNumber(systemVoltageV, 'systemVoltageV', { greaterThan: 0, max: 5000 });
  const row = TABLES[edition].find((r) =>
    r.upToV === 120 ? systemVoltageV < 120 : systemVoltageV <= r.upToV,
  );
  if (row === undefined) throw new RangeError(`no insulation table row for ${systemVoltageV} V`);
  return {
    testVoltageV: row.testVoltageV,
    minResistanceMOhm: row.minResistanceMOhm,
    edition: edition === '2009' ? 'IEC 62446:2009' : 'IEC 62446-1:2016',
    note: NOTES[edition],
  };
}
