import { Op } from 'sequelize';
import type { Instrument as InstrumentDto, InstrumentInput } from '@stringfield/shared';
import { AppError, notFound } from '../lib/app-error.ts';
import { Instrument } from '../models/index.ts';

function toDto(i: Instrument, today = new Date().toISOString().slice(0, 10)): InstrumentDto {
  return {
    id: i.id,
    kind: i.kind as InstrumentDto['kind'],
    serial: i.serial,
    model: i.model,
    calibrationDueOn: i.calibrationDueOn,
    isCalibrationOverdue: i.calibrationDueOn < today,
    isArchived: i.isArchived,
  };
}

export async function listInstruments(includeArchived: boolean): Promise<InstrumentDto[]> {
  const rows = await Instrument.findAll({ where: includeArchived ? {} : { isArchived: false }, order: [['kind', 'ASC'], ['serial', 'ASC']] });
  return rows.map((r) => toDto(r));
}

export async function createInstrument(input: InstrumentInput): Promise<InstrumentDto> {
  if (await Instrument.findOne({ where: { kind: input.kind, serial: input.serial } })) {
    throw new AppError('CONFLICT', `A ${input.kind.replace('_', ' ')} with serial ${input.serial} is already registered.`, { serial: 'Already registered' });
  }
  return toDto(await Instrument.create(input));
}

export async function updateInstrument(id: number, input: Partial<InstrumentInput> & { isArchived?: boolean }): Promise<InstrumentDto> {
  const i = await Instrument.findByPk(id);
  if (!i) throw notFound('That instrument');
  if (input.serial && (await Instrument.findOne({ where: { kind: input.kind ?? i.kind, serial: input.serial, id: { [Op.ne]: id } } }))) {
    throw new AppError('CONFLICT', `Serial ${input.serial} is already registered.`, { serial: 'Already registered' });
  }
  await i.update(input);
  return toDto(i);
}
