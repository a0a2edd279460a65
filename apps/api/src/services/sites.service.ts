import { Op, QueryTypes, type WhereOptions } from 'sequelize';
import type { Page, PageQuery, SessionUser, Site as SiteDto, SiteInput, SiteUpdate, listQuerySchema } from '@stringfield/shared';
import type { z } from 'zod';
import { AppError } from '../lib/app-error.ts';
import { Site, SiteOwner, User, sequelize } from '../models/index.ts';
import { findVisibleSite, visibleSiteIds } from './site-access.ts';
import { sizingFailuresByCombo } from './sizing.service.ts';

type SiteListQuery = z.infer<typeof listQuerySchema> & PageQuery & { sort: 'name' | '-name' | 'code' | '-code' };

type SiteStats = { inverterCount: number; stringCount: number; sizingFailCount: number };

async function statsFor(siteIds: number[]): Promise<Map<number, SiteStats>> {
  const stats = new Map<number, SiteStats>(siteIds.map((id) => [id, { inverterCount: 0, stringCount: 0, sizingFailCount: 0 }]));
  if (siteIds.length === 0) return stats;
  const inverters = await sequelize.query<{ site_id: number; n: number }>(
    'SELECT site_id, COUNT(*) AS n FROM inverters WHERE site_id IN (:ids) AND is_archived = 0 GROUP BY site_id',
    { replacements: { ids: siteIds }, type: QueryTypes.SELECT },
  );
  for (const r of inverters) stats.get(r.site_id)!.inverterCount = Number(r.n);
  const failures = await sizingFailuresByCombo(siteIds);
  for (const combo of failures) {
    const s = stats.get(combo.siteId)!;
    s.stringCount += combo.count;
    if (combo.failures.length > 0) s.sizingFailCount += combo.count;
  }
  return stats;
}

async function ownersOf(siteIds: number[]): Promise<Map<number, number[]>> {
  const rows = siteIds.length ? await SiteOwner.findAll({ where: { siteId: { [Op.in]: siteIds } } }) : [];
  const map = new Map<number, number[]>();
  for (const r of rows) map.set(r.siteId, [...(map.get(r.siteId) ?? []), r.userId]);
  return map;
}

function toDto(site: Site, stats: SiteStats, ownerUserIds: number[]): SiteDto {
  return {
    id: site.id,
    name: site.name,
    code: site.code,
    address: site.address,
    timeZone: site.timeZone,
    lowestAmbientC: site.lowestAmbientC,
    highestAmbientC: site.highestAmbientC,
    designIrradianceWm2: site.designIrradianceWm2,
    peakSunHours: site.peakSunHours,
    ownerContactEmail: site.ownerContactEmail,
    ownerUserIds,
    isArchived: site.isArchived,
    ...stats,
  };
}

export async function listSites(user: SessionUser, q: SiteListQuery): Promise<Page<SiteDto>> {
  const where: WhereOptions<Site>[] = [];
  const visible = await visibleSiteIds(user);
  if (visible) where.push({ id: { [Op.in]: visible } });
  if (!q.includeArchived) where.push({ isArchived: false });
  if (q.q) {
    const like = `%${q.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    where.push({ [Op.or]: [{ name: { [Op.like]: like } }, { code: { [Op.like]: like } }] });
  }
  const column = q.sort.replace(/^-/, '') as 'name' | 'code';
  const { rows, count } = await Site.findAndCountAll({
    where: { [Op.and]: where },
    order: [[column, q.sort.startsWith('-') ? 'DESC' : 'ASC'], ['id', 'ASC']],
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  });
  const ids = rows.map((r) => r.id);
  const [stats, owners] = await Promise.all([statsFor(ids), ownersOf(ids)]);
  return {
    items: rows.map((r) => toDto(r, stats.get(r.id)!, owners.get(r.id) ?? [])),
    total: count,
    page: q.page,
    pageSize: q.pageSize,
  };
}

export async function getSite(user: SessionUser, id: number): Promise<SiteDto> {
  const site = await findVisibleSite(user, id);
  const [stats, owners] = await Promise.all([statsFor([id]), ownersOf([id])]);
  return toDto(site, stats.get(id)!, owners.get(id) ?? []);
}

async function checkOwners(ids: number[]): Promise<void> {
  if (ids.length === 0) return;
  const owners = await User.count({ where: { id: { [Op.in]: ids }, role: 'owner' } });
  if (owners !== new Set(ids).size) {
    throw new AppError('VALIDATION_FAILED', 'Every assigned account must be an asset-owner account.', {
      ownerUserIds: 'Choose asset-owner accounts only',
    });
  }
}

export async function createSite(input: SiteInput): Promise<SiteDto> {
  if (await Site.findOne({ where: { code: input.code } })) {
    throw new AppError('CONFLICT', `Site code ${input.code} is already used.`, { code: 'This code is already used' });
  }
  await checkOwners(input.ownerUserIds);
  const site = await sequelize.transaction(async (transaction) => {
    const { ownerUserIds, ...fields } = input;
    const created = await Site.create(fields, { transaction });
    await SiteOwner.bulkCreate(
      [...new Set(ownerUserIds)].map((userId) => ({ siteId: created.id, userId })),
      { transaction },
    );
    return created;
  });
  return toDto(site, { inverterCount: 0, stringCount: 0, sizingFailCount: 0 }, input.ownerUserIds);
}

export async function updateSite(user: SessionUser, id: number, input: SiteUpdate): Promise<SiteDto> {
  const site = await findVisibleSite(user, id);
  const low = input.lowestAmbientC ?? site.lowestAmbientC;
  const high = input.highestAmbientC ?? site.highestAmbientC;
  if (low >= high) {
    throw new AppError('VALIDATION_FAILED', 'The highest ambient must be above the lowest.', {
      highestAmbientC: 'Must be above the lowest ambient',
    });
  }
  if (input.ownerUserIds) await checkOwners(input.ownerUserIds);
  await sequelize.transaction(async (transaction) => {
    const { ownerUserIds, ...fields } = input;
    await site.update(fields, { transaction });
    if (ownerUserIds) {
      await SiteOwner.destroy({ where: { siteId: id }, transaction });
      await SiteOwner.bulkCreate(
        [...new Set(ownerUserIds)].map((userId) => ({ siteId: id, userId })),
        { transaction },
      );
    }
  });
  return getSite(user, id);
}

/** Delete a site that holds nothing; a site with equipment is archived instead (409 says so). */
export async function deleteSite(user: SessionUser, id: number): Promise<void> {
  const site = await findVisibleSite(user, id);
  const [[row]] = (await sequelize.query(
    'SELECT (SELECT COUNT(*) FROM inverters WHERE site_id = :id) + (SELECT COUNT(*) FROM pv_strings WHERE site_id = :id) + (SELECT COUNT(*) FROM combiner_boxes WHERE site_id = :id) AS n',
    { replacements: { id } },
  )) as unknown as [[{ n: number }]];
  if (Number(row.n) > 0) {
    throw new AppError('CONFLICT', `${site.name} still has inverters, combiner boxes or strings. Archive the site instead.`);
  }
  await site.destroy();
}
