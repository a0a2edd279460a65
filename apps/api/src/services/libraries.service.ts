import { Op, QueryTypes, type WhereOptions } from 'sequelize';
import type {
  InverterModel as InverterModelDto,
  InverterModelInput,
  ModuleModel as ModuleModelDto,
  ModuleModelInput,
  Page,
  PageQuery,
  listQuerySchema,
} from '@stringfield/shared';
import type { z } from 'zod';
import { AppError, notFound } from '../lib/app-error.ts';
import { InverterModel, ModuleModel, sequelize } from '../models/index.ts';
import { inverterModelDto, moduleModelDto } from './dto.ts';

type LibraryQuery = z.infer<typeof listQuerySchema> & PageQuery;

function textFilter(q: LibraryQuery) {
  const where: WhereOptions[] = [];
  if (!q.includeArchived) where.push({ isArchived: false });
  if (q.q) {
    const like = `%${q.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    where.push({ [Op.or]: [{ maker: { [Op.like]: like } }, { model: { [Op.like]: like } }] });
  }
  return { [Op.and]: where };
}

async function usage(sql: string, ids: number[]): Promise<Map<number, number>> {
  if (ids.length === 0) return new Map();
  const rows = await sequelize.query<{ id: number; n: number }>(sql, { replacements: { ids }, type: QueryTypes.SELECT });
  return new Map(rows.map((r) => [r.id, Number(r.n)]));
}

const moduleUsageSql = 'SELECT module_model_id AS id, COUNT(*) AS n FROM pv_strings WHERE module_model_id IN (:ids) GROUP BY module_model_id';
const inverterUsageSql = 'SELECT inverter_model_id AS id, COUNT(*) AS n FROM inverters WHERE inverter_model_id IN (:ids) GROUP BY inverter_model_id';

export async function listModuleModels(q: LibraryQuery): Promise<Page<ModuleModelDto>> {
  const { rows, count } = await ModuleModel.findAndCountAll({
    where: textFilter(q),
    order: [['maker', 'ASC'], ['model', 'ASC']],
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  });
  const used = await usage(moduleUsageSql, rows.map((r) => r.id));
  return { items: rows.map((r) => moduleModelDto(r, used.get(r.id) ?? 0)), total: count, page: q.page, pageSize: q.pageSize };
}

async function uniqueName(model: typeof ModuleModel | typeof InverterModel, maker: string, name: string, exceptId?: number) {
  const clash = await (model as typeof ModuleModel).findOne({ where: { maker, model: name, ...(exceptId ? { id: { [Op.ne]: exceptId } } : {}) } });
  if (clash) throw new AppError('CONFLICT', `${maker} ${name} is already in the library.`, { model: 'Already in the library' });
}

export async function createModuleModel(input: ModuleModelInput): Promise<ModuleModelDto> {
  await uniqueName(ModuleModel, input.maker, input.model);
  return moduleModelDto(await ModuleModel.create({ ...input, noctC: input.noctC ?? null }));
}

export async function updateModuleModel(id: number, input: ModuleModelInput & { isArchived?: boolean }): Promise<ModuleModelDto> {
  const m = await ModuleModel.findByPk(id);
  if (!m) throw notFound('That module model');
  await uniqueName(ModuleModel, input.maker, input.model, id);
  await m.update({ ...input, noctC: input.noctC ?? null });
  const used = await usage(moduleUsageSql, [id]);
  return moduleModelDto(m, used.get(id) ?? 0);
}

export async function setModuleModelArchived(id: number, isArchived: boolean): Promise<ModuleModelDto> {
  const m = await ModuleModel.findByPk(id);
  if (!m) throw notFound('That module model');
  await m.update({ isArchived });
  return moduleModelDto(m, (await usage(moduleUsageSql, [id])).get(id) ?? 0);
}

export async function deleteModuleModel(id: number): Promise<void> {
  const m = await ModuleModel.findByPk(id);
  if (!m) throw notFound('That module model');
  const n = (await usage(moduleUsageSql, [id])).get(id) ?? 0;
  if (n > 0) throw new AppError('CONFLICT', `${m.model} is used by ${n} string${n === 1 ? '' : 's'}. Archive it instead of deleting it.`);
  await m.destroy();
}

export async function listInverterModels(q: LibraryQuery): Promise<Page<InverterModelDto>> {
  const { rows, count } = await InverterModel.findAndCountAll({
    where: textFilter(q),
    order: [['maker', 'ASC'], ['model', 'ASC']],
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  });
  const used = await usage(inverterUsageSql, rows.map((r) => r.id));
  return { items: rows.map((r) => inverterModelDto(r, used.get(r.id) ?? 0)), total: count, page: q.page, pageSize: q.pageSize };
}

export async function createInverterModel(input: InverterModelInput): Promise<InverterModelDto> {
  await uniqueName(InverterModel, input.maker, input.model);
  return inverterModelDto(await InverterModel.create(input));
}

export async function updateInverterModel(id: number, input: InverterModelInput): Promise<InverterModelDto> {
  const m = await InverterModel.findByPk(id);
  if (!m) throw notFound('That inverter model');
  await uniqueName(InverterModel, input.maker, input.model, id);
  await m.update(input);
  return inverterModelDto(m, (await usage(inverterUsageSql, [id])).get(id) ?? 0);
}

export async function setInverterModelArchived(id: number, isArchived: boolean): Promise<InverterModelDto> {
  const m = await InverterModel.findByPk(id);
  if (!m) throw notFound('That inverter model');
  await m.update({ isArchived });
  return inverterModelDto(m, (await usage(inverterUsageSql, [id])).get(id) ?? 0);
}

export async function deleteInverterModel(id: number): Promise<void> {
  const m = await InverterModel.findByPk(id);
  if (!m) throw notFound('That inverter model');
  const n = (await usage(inverterUsageSql, [id])).get(id) ?? 0;
  if (n > 0) throw new AppError('CONFLICT', `${m.model} is used by ${n} inverter${n === 1 ? '' : 's'}. Archive it instead of deleting it.`);
  await m.destroy();
}
