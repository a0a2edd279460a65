import type { SessionUser } from '@stringfield/shared';
import { notFound } from '../lib/app-error.ts';
import { Site, SiteOwner } from '../models/index.ts';

/** The ids of the sites a user may see, or null for every site (everyone but owners). */
export async function visibleSiteIds(user: SessionUser): Promise<number[] | null> {
  if (user.role !== 'owner') return null;
  const rows = await SiteOwner.findAll({ where: { userId: user.id }, attributes: ['siteId'] });
  return rows.map((r) => r.siteId);
}

/** Load a site the user may see; an owner asking for another owner's site gets the same 404 as a missing one. */
export async function findVisibleSite(user: SessionUser, siteId: number): Promise<Site> {
  const ids = await visibleSiteIds(user);
  if (ids && !ids.includes(siteId)) throw notFound('That site');
  const site = await Site.findByPk(siteId);
  if (!site) throw notFound('That site');
  return site;
}
