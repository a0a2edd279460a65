import type { Instrument, StringCheck, StringCheckInput } from '@stringfield/shared';
import type { StringSpec } from './string-spec';

/** The demo plant's 405 W module, 25 in series (Ostrander Ridge INV03-MPPT4-S1). */
export function buildStringSpec(overrides: Partial<StringSpec> = {}): StringSpec {
  return {
    stringId: 661,
    label: 'INV03-MPPT4-S1',
    modulesInSeries: 25,
    moduleName: 'Stringfield Demo Modules SDM-405-72M',
    module: {
      pmaxW: 405,
      vocV: 49.8,
      iscA: 10.35,
      vmpV: 41.7,
      impA: 9.71,
      alphaIscPctPerC: 0.048,
      betaVocPctPerC: -0.27,
      gammaPmaxPctPerC: -0.35,
      cellsInSeries: 72,
      bypassDiodes: 3,
      noctC: 44,
    },
    ...overrides,
  };
}

export function buildCheckInput(overrides: Partial<StringCheckInput> = {}): StringCheckInput {
  return {
    clientId: '6f1c2a52-8d8e-4b8e-9a55-0c7a2b7d9e01',
    stringId: 661,
    phase: 'before',
    takenAt: '2026-12-01T18:30:00.000Z',
    vocV: 1151.5,
    iscA: 8.2,
    irradianceWm2: 800,
    irradianceMethod: 'reference_cell',
    moduleTempC: 45,
    moduleTempMethod: 'back_sensor',
    polarityCorrect: true,
    instrumentIds: [],
    notes: '',
    ...overrides,
  };
}

export function buildStringCheck(overrides: Partial<StringCheck> = {}): StringCheck {
  return {
    id: 1,
    clientId: '0d6c3f6e-1f57-4d0a-a3c9-3d0b1e6f7a10',
    workOrderId: 16,
    workOrderNumber: 'WO-2026-00016',
    stringId: 661,
    stringLabel: 'INV03-MPPT4-S1',
    phase: 'before',
    takenAt: '2026-12-01T18:00:00.000Z',
    technician: { id: 3, name: 'Demo Technician' },
    vocV: 1151.5,
    iscA: 8.2,
    operatingCurrentA: null,
    operatingVoltageV: null,
    irradianceWm2: 800,
    irradianceMethod: 'reference_cell',
    moduleTempC: 45,
    moduleTempMethod: 'back_sensor',
    ambientC: 18,
    polarityCorrect: true,
    insulationPlusMOhm: null,
    insulationMinusMOhm: null,
    insulationTestVoltageV: null,
    instrumentIds: [2],
    notes: 'Connector MC4 warm',
    expected: null,
    vocDeviationPct: null,
    iscDeviationPct: null,
    verdict: 'fail',
    findings: [],
    peers: [],
    isCalibrationOverdue: false,
    engineVersion: 'test',
    supersedesId: null,
    supersededById: null,
    hasIvTrace: false,
    createdAt: '2026-12-01T18:00:05.000Z',
    ...overrides,
  };
}

export function buildInstrument(overrides: Partial<Instrument> = {}): Instrument {
  return {
    id: 2,
    kind: 'multimeter',
    serial: 'FL-1587-0042',
    model: 'Fluke 1587',
    calibrationDueOn: '2027-06-30',
    isCalibrationOverdue: false,
    isArchived: false,
    ...overrides,
  };
}
