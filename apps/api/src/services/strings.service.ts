import { Op, type Order, type WhereOptions } from 'sequelize';
import type {
  Page,
  PageQuery,
  PvString as PvStringDto,
  PvStringDetail,
  PvStringInput,
  SessionUser,
  pvStringUpdateSchema,
  stringListQuerySchema,
} from '@stringfield/shared';
import type { z } from 'zod';
import { AppError, notFound } from '../lib/app-error.ts';
import { CombinerBox, Inverter, InverterModel, ModuleModel, PvString, sequelize } from '../models/index.ts';
import { inverterModelDto, moduleModelDto, pvStringDto } from './dto.ts';
import { findVisibleSite } from './site-access.ts';
import { sizingChecks, sizingFailuresByCombo, type ComboFailures } from './sizing.service.ts';

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;

type StringListQuery = z.infer<typeof stringListQuerySchema> & PageQuery;
type StringUpdate = z.infer<typeof pvStringUpdateSchema>;

const comboKey = (c: Pick<ComboFailures, 'moduleModelId' | 'inverterModelId' | 'modulesInSeries' | 'stringsInParallel'>) =>
  `${c.moduleModelId}|${c.inverterModelId}|${c.modulesInSeries}|${c.stringsInParallel}`;

const includes = [
  { model: Inverter, as: 'inverter', attributes: ['id', 'tag', 'inverterModelId'] },
  { model: CombinerBox, as: 'combinerBox', attributes: ['id', 'tag'] },
  { model: ModuleModel, as: 'moduleModel', attributes: ['id', 'model'] },
];

export async function listStrings(user: SessionUser, siteId: number, q: StringListQuery): Promise<Page<PvStringDto>> {
  await findVisibleSite(user, siteId);
  const combos = await sizingFailuresByCombo([siteId]);
  const failuresByKey = new Map(combos.map((c) => [comboKey(c), c.failures]));

  const where: WhereOptions<PvString>[] = [{ siteId }];
  if (!q.includeArchived) where.push({ isArchived: false });
  if (q.q) where.push({ label: { [Op.like]: `%${q.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%` } });
  if (q.inverterId) where.push({ inverterId: q.inverterId });
  if (q.mpptInput) where.push({ mpptInput: q.mpptInput });
  if (q.moduleModelId) where.push({ moduleModelId: q.moduleModelId });
  if (q.combinerBoxId) where.push({ combinerBoxId: q.combinerBoxId });
  if (q.sizing !== 'all') {
    const wanted = combos.filter((c) => (q.sizing === 'fail') === c.failures.length > 0);
    where.push({
      [Op.or]: wanted.length
        ? wanted.map((c) => ({
            moduleModelId: c.moduleModelId,
            modulesInSeries: c.modulesInSeries,
            stringsInParallel: c.stringsInParallel,
            '$inverter.inverter_model_id$': c.inverterModelId,
          }))
        : [{ id: -1 }],
    });
  }
  const desc = q.sort.startsWith('-') ? 'DESC' : 'ASC';
  const key = q.sort.replace(/^-/, '');
  const order: Order =
    key === 'inverter'
      ? [[{ model: Inverter, as: 'inverter' }, 'tag', desc], ['mpptInput', desc], ['label', desc]]
      : [[key, desc], ['id', 'ASC']];
  const { rows, count } = await PvString.findAndCountAll({
    where: { [Op.and]: where },
    include: includes,
    order,
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
    distinct: true,
  });
  return {
    items: rows.map((s) =>
      pvStringDto(
        s,
        failuresByKey.get(
          comboKey({
            moduleModelId: s.moduleModelId,
            inverterModelId: s.inverter!.inverterModelId,
            modulesInSeries: s.modulesInSeries,
            stringsInParallel: s.stringsInParallel,
          }),
        ) ?? [],
      ),
    ),
    total: count,
    page: q.page,
    pageSize: q.pageSize,
  };
}

async function loadString(id: number): Promise<PvString> {
  const s = await PvString.findByPk(id, {
    include: [
      { model: Inverter, as: 'inverter', include: [{ model: InverterModel, as: 'inverterModel' }] },
      { model: CombinerBox, as: 'combinerBox' },
      { model: ModuleModel, as: 'moduleModel' },
    ],
  });
  if (!s) throw notFound('That string');
  return s;
}

export async function getString(user: SessionUser, id: number): Promise<PvStringDetail> {
  const s = await loadString(id);
  const site = await findVisibleSite(user, s.siteId).catch(() => {
    throw notFound('That string');
  });
  const inverterModel = s.inverter!.inverterModel!;
  const sizing = sizingChecks({
    moduleModel: s.moduleModel!,
    inverterModel,
    site,
    modulesInSeries: s.modulesInSeries,
    stringsInParallel: s.stringsInParallel,
  });
  return {
    ...pvStringDto(s, sizing.filter((c) => !c.ok).map((c) => c.code)),
    site: {
      id: site.id,
      name: site.name,
      code: site.code,
      timeZone: site.timeZone,
      lowestAmbientC: site.lowestAmbientC,
      highestAmbientC: site.highestAmbientC,
      designIrradianceWm2: site.designIrradianceWm2,
    },
    module: moduleModelDto(s.moduleModel!),
    inverter: { id: s.inverter!.id, tag: s.inverter!.tag, serial: s.inverter!.serial, model: inverterModelDto(inverterModel) },
    sizing,
  };
}

/** Check that the inverter, MPPT input, combiner box and module model belong together and to the site. */
async function checkReferences(siteId: number, input: Partial<PvStringInput>, current?: PvString): Promise<void> {
  const inverterId = input.inverterId ?? current?.inverterId;
  const mpptInput = input.mpptInput ?? current?.mpptInput;
  const inverter = inverterId
    ? await Inverter.findByPk(inverterId, { include: [{ model: InverterModel, as: 'inverterModel' }] })
    : null;
  if (!inverter || inverter.siteId !== siteId) {
    throw new AppError('VALIDATION_FAILED', 'Choose an inverter of this site.', { inverterId: 'Not an inverter of this site' });
  }
  if (mpptInput && mpptInput > inverter.inverterModel!.mpptInputs) {
    throw new AppError('VALIDATION_FAILED', `${inverter.tag} has ${inverter.inverterModel!.mpptInputs} MPPT inputs.`, {
      mpptInput: `Choose 1 to ${inverter.inverterModel!.mpptInputs}`,
    });
  }
  const combinerBoxId = input.combinerBoxId === undefined ? current?.combinerBoxId : input.combinerBoxId;
  if (combinerBoxId) {
    const box = await CombinerBox.findByPk(combinerBoxId);
    if (!box || box.siteId !== siteId) {
      throw new AppError('VALIDATION_FAILED', 'Choose a combiner box of this site.', { combinerBoxId: 'Not a combiner box of this site' });
    }
  }
  if (input.moduleModelId && !(await ModuleModel.findByPk(input.moduleModelId))) {
    throw new AppError('VALIDATION_FAILED', 'Choose a module model from the library.', { moduleModelId: 'Unknown module model' });
  }
}

export async function createString(user: SessionUser, siteId: number, input: PvStringInput): Promise<PvStringDetail> {
  await findVisibleSite(user, siteId);
  await checkReferences(siteId, input);
  if (await PvString.findOne({ where: { siteId, label: input.label } })) {
    throw new AppError('CONFLICT', `A string labelled ${input.label} already exists at this site.`, { label: 'Label already used' });
  }
  const created = await PvString.create({ ...input, siteId });
  return getString(user, created.id);
}

export async function updateString(user: SessionUser, id: number, input: StringUpdate): Promise<PvStringDetail> {
  const s = await loadString(id);
  await findVisibleSite(user, s.siteId);
  await checkReferences(s.siteId, input, s);
  if (input.label && input.label !== s.label && (await PvString.findOne({ where: { siteId: s.siteId, label: input.label } }))) {
    throw new AppError('CONFLICT', `A string labelled ${input.label} already exists at this site.`, { label: 'Label already used' });
  }
  await s.update(input);
  return getString(user, id);
}

/** Delete a string; one that work orders reference is refused (archive it instead). */
export async function deleteString(user: SessionUser, id: number): Promise<void> {
  const s = await loadString(id);
  await findVisibleSite(user, s.siteId);
  const [[row]] = (await sequelize.query('SELECT COUNT(*) AS n FROM work_order_strings WHERE string_id = :id', {
    replacements: { id },
  })) as unknown as [[{ n: number }]];
  if (Number(row.n) > 0) {
    throw new AppError('CONFLICT', `${s.label} is on ${plural(Number(row.n), 'work order')} and keeps its history. Archive it instead.`);
  }
  await s.destroy();
}
