import { Op, QueryTypes } from 'sequelize';
import type {
  CombinerBox as CombinerBoxDto,
  CombinerBoxInput,
  Inverter as InverterDto,
  InverterInput,
  SessionUser,
} from '@stringfield/shared';
import { AppError, notFound } from '../lib/app-error.ts';
import { CombinerBox, Inverter, InverterModel, sequelize } from '../models/index.ts';
import { combinerBoxDto, inverterDto } from './dto.ts';
import { findVisibleSite } from './site-access.ts';

async function stringCounts(column: 'inverter_id' | 'combiner_box_id', ids: number[]) {
  if (ids.length === 0) return new Map<number, number>();
  const rows = await sequelize.query<{ id: number; n: number }>(
    `SELECT ${column} AS id, COUNT(*) AS n FROM pv_strings WHERE ${column} IN (:ids) GROUP BY ${column}`,
    { replacements: { ids }, type: QueryTypes.SELECT },
  );
  return new Map(rows.map((r) => [r.id, Number(r.n)]));
}

export async function listInverters(user: SessionUser, siteId: number, includeArchived: boolean): Promise<InverterDto[]> {
  await findVisibleSite(user, siteId);
  const rows = await Inverter.findAll({
    where: { siteId, ...(includeArchived ? {} : { isArchived: false }) },
    include: [{ model: InverterModel, as: 'inverterModel' }],
    order: [['tag', 'ASC']],
  });
  const counts = await stringCounts('inverter_id', rows.map((r) => r.id));
  return rows.map((r) => inverterDto(r, counts.get(r.id) ?? 0));
}

export async function createInverter(user: SessionUser, input: InverterInput): Promise<InverterDto> {
  await findVisibleSite(user, input.siteId);
  const model = await InverterModel.findByPk(input.inverterModelId);
  if (!model) throw new AppError('VALIDATION_FAILED', 'Choose an inverter model from the library.', { inverterModelId: 'Unknown inverter model' });
  if (await Inverter.findOne({ where: { siteId: input.siteId, tag: input.tag } })) {
    throw new AppError('CONFLICT', `Inverter ${input.tag} already exists at this site.`, { tag: 'Tag already used' });
  }
  const created = await Inverter.create(input);
  created.inverterModel = model;
  return inverterDto(created);
}

export async function updateInverter(
  user: SessionUser,
  id: number,
  input: Partial<Omit<InverterInput, 'siteId'>> & { isArchived?: boolean },
): Promise<InverterDto> {
  const inv = await Inverter.findByPk(id);
  if (!inv) throw notFound('That inverter');
  await findVisibleSite(user, inv.siteId);
  if (input.tag && (await Inverter.findOne({ where: { siteId: inv.siteId, tag: input.tag, id: { [Op.ne]: id } } }))) {
    throw new AppError('CONFLICT', `Inverter ${input.tag} already exists at this site.`, { tag: 'Tag already used' });
  }
  if (input.inverterModelId && !(await InverterModel.findByPk(input.inverterModelId))) {
    throw new AppError('VALIDATION_FAILED', 'Choose an inverter model from the library.', { inverterModelId: 'Unknown inverter model' });
  }
  await inv.update(input);
  await inv.reload({ include: [{ model: InverterModel, as: 'inverterModel' }] });
  return inverterDto(inv, (await stringCounts('inverter_id', [id])).get(id) ?? 0);
}

export async function deleteInverter(user: SessionUser, id: number): Promise<void> {
  const inv = await Inverter.findByPk(id);
  if (!inv) throw notFound('That inverter');
  await findVisibleSite(user, inv.siteId);
  const n = (await stringCounts('inverter_id', [id])).get(id) ?? 0;
  if (n > 0) throw new AppError('CONFLICT', `${inv.tag} has ${n} string${n === 1 ? '' : 's'}. Archive it instead of deleting it.`);
  await inv.destroy();
}

export async function listCombinerBoxes(user: SessionUser, siteId: number, includeArchived: boolean): Promise<CombinerBoxDto[]> {
  await findVisibleSite(user, siteId);
  const rows = await CombinerBox.findAll({
    where: { siteId, ...(includeArchived ? {} : { isArchived: false }) },
    order: [['tag', 'ASC']],
  });
  const counts = await stringCounts('combiner_box_id', rows.map((r) => r.id));
  return rows.map((r) => combinerBoxDto(r, counts.get(r.id) ?? 0));
}

export async function createCombinerBox(user: SessionUser, input: CombinerBoxInput): Promise<CombinerBoxDto> {
  await findVisibleSite(user, input.siteId);
  if (await CombinerBox.findOne({ where: { siteId: input.siteId, tag: input.tag } })) {
    throw new AppError('CONFLICT', `Combiner box ${input.tag} already exists at this site.`, { tag: 'Tag already used' });
  }
  return combinerBoxDto(await CombinerBox.create(input));
}

export async function updateCombinerBox(
  user: SessionUser,
  id: number,
  input: Partial<Omit<CombinerBoxInput, 'siteId'>> & { isArchived?: boolean },
): Promise<CombinerBoxDto> {
  const box = await CombinerBox.findByPk(id);
  if (!box) throw notFound('That combiner box');
  await findVisibleSite(user, box.siteId);
  if (input.tag && (await CombinerBox.findOne({ where: { siteId: box.siteId, tag: input.tag, id: { [Op.ne]: id } } }))) {
    throw new AppError('CONFLICT', `Combiner box ${input.tag} already exists at this site.`, { tag: 'Tag already used' });
  }
  await box.update(input);
  return combinerBoxDto(box, (await stringCounts('combiner_box_id', [id])).get(id) ?? 0);
}

export async function deleteCombinerBox(user: SessionUser, id: number): Promise<void> {
  const box = await CombinerBox.findByPk(id);
  if (!box) throw notFound('That combiner box');
  await findVisibleSite(user, box.siteId);
  const n = (await stringCounts('combiner_box_id', [id])).get(id) ?? 0;
  if (n > 0) throw new AppError('CONFLICT', `${box.tag} has ${n} string${n === 1 ? '' : 's'}. Archive it instead of deleting it.`);
  await box.destroy();
}
