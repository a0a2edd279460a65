import { photoTagLabels, photoTags, type Photo } from '@stringfield/shared';

export type PhotoTag = (typeof photoTags)[number];
export type TicketString = { id: number; label: string };

export type PhotoTagGroup = { tag: PhotoTag; label: string; photos: Photo[] };
export type PhotoGroup = {
  /** `string-<id>` or `none`; also the anchor of the group in the gallery. */
  key: string;
  stringId: number | null;
  title: string;
  count: number;
  tags: PhotoTagGroup[];
};

/**
 * Groups a ticket's photos by string (in the ticket's order, then strings no longer on it, then
 * photos tied to no string) and, within a string, by tag in the order of the work (before,
 * after, thermal, nameplate, other). Oldest first inside a tag.
 */
export function groupPhotos(photos: readonly Photo[], strings: readonly TicketString[]): PhotoGroup[] {
  const byString = new Map<number | null, Photo[]>();
  for (const p of photos) {
    const list = byString.get(p.stringId) ?? [];
    list.push(p);
    byString.set(p.stringId, list);
  }
  const order: Array<{ stringId: number | null; title: string }> = strings.filter((s) => byString.has(s.id)).map((s) => ({ stringId: s.id, title: s.label }));
  const known = new Set(strings.map((s) => s.id));
  const strays = [...byString.keys()]
    .filter((id): id is number => id !== null && !known.has(id))
    .map((id) => ({ stringId: id, title: byString.get(id)?.[0]?.stringLabel ?? `String ${id}` }))
    .sort((a, b) => a.title.localeCompare(b.title));
  order.push(...strays);
  if (byString.has(null)) order.push({ stringId: null, title: 'Not tied to a string' });

  return order.map(({ stringId, title }) => {
    const list = [...(byString.get(stringId) ?? [])].sort((a, b) => a.createdAt.localeCompare(b.createdAt) || a.id - b.id);
    return {
      key: stringId === null ? 'none' : `string-${stringId}`,
      stringId,
      title,
      count: list.length,
      tags: photoTags
        .map((tag) => ({ tag, label: photoTagLabels[tag], photos: list.filter((p) => p.tag === tag) }))
        .filter((g) => g.photos.length > 0),
    };
  });
}

/** The photos in the order the gallery shows them, for the viewer's previous/next. */
export function viewerOrder(groups: readonly PhotoGroup[]): Photo[] {
  return groups.flatMap((g) => g.tags.flatMap((t) => t.photos));
}

/** Alternative text: the caption if there is one, else what it shows and where. */
export function photoAlt(photo: Pick<Photo, 'caption' | 'tag' | 'stringLabel' | 'modulePosition'>): string {
  const where = [photo.stringLabel, photo.modulePosition ? `module ${photo.modulePosition}` : null].filter(Boolean).join(', ');
  const tag = photoTagLabels[photo.tag];
  const of = where ? ` of ${where}` : '';
  return photo.caption.trim() ? `${photo.caption.trim()} (${tag.toLowerCase()}${of})` : `${tag}${of}`;
}
