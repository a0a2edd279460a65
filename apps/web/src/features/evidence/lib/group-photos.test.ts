import { describe, expect, it } from 'vitest';
import { groupPhotos, photoAlt, viewerOrder } from './group-photos';
import { buildPhoto } from './test-factories';

const strings = [
  { id: 154, label: 'INV07-MPPT3-S2' },
  { id: 155, label: 'INV07-MPPT3-S3' },
];

describe('groupPhotos', () => {
  it('groups by string in the ticket’s order, then by tag in the order of the work', () => {
    const photos = [
      buildPhoto({ id: 1, stringId: 155, stringLabel: 'INV07-MPPT3-S3', tag: 'after' }),
      buildPhoto({ id: 2, stringId: 154, tag: 'after' }),
      buildPhoto({ id: 3, stringId: 154, tag: 'thermal' }),
      buildPhoto({ id: 4, stringId: 154, tag: 'before' }),
    ];
    const groups = groupPhotos(photos, strings);
    expect(groups.map((g) => g.title)).toEqual(['INV07-MPPT3-S2', 'INV07-MPPT3-S3']);
    expect(groups[0]!.tags.map((t) => t.tag)).toEqual(['before', 'after', 'thermal']);
    expect(groups[0]!.count).toBe(3);
    expect(groups[0]!.key).toBe('string-154');
  });

  it('puts photos of a string no longer on the ticket after the ticket’s strings, and untied photos last', () => {
    const photos = [
      buildPhoto({ id: 1, stringId: null, stringLabel: null, tag: 'nameplate' }),
      buildPhoto({ id: 2, stringId: 999, stringLabel: 'INV01-MPPT1-S1', tag: 'other' }),
      buildPhoto({ id: 3, stringId: 154, tag: 'before' }),
    ];
    const groups = groupPhotos(photos, strings);
    expect(groups.map((g) => g.title)).toEqual(['INV07-MPPT3-S2', 'INV01-MPPT1-S1', 'Not tied to a string']);
    expect(groups.at(-1)!.key).toBe('none');
  });

  it('leaves out strings without photos and tags without photos', () => {
    const groups = groupPhotos([buildPhoto({ id: 1, stringId: 155, stringLabel: 'INV07-MPPT3-S3', tag: 'after' })], strings);
    expect(groups).toHaveLength(1);
    expect(groups[0]!.tags.map((t) => t.tag)).toEqual(['after']);
  });

  it('keeps the oldest first inside a tag, so the viewer walks the work in time order', () => {
    const photos = [
      buildPhoto({ id: 7, tag: 'before', createdAt: '2026-12-01T11:00:00.000Z' }),
      buildPhoto({ id: 5, tag: 'before', createdAt: '2026-12-01T09:00:00.000Z' }),
      buildPhoto({ id: 6, tag: 'after', createdAt: '2026-12-01T08:00:00.000Z' }),
    ];
    expect(viewerOrder(groupPhotos(photos, strings)).map((p) => p.id)).toEqual([5, 7, 6]);
  });

  it('returns nothing for a ticket without photos', () => {
    expect(groupPhotos([], strings)).toEqual([]);
  });
});

describe('photoAlt', () => {
  it('uses the caption and says what and where', () => {
    expect(photoAlt(buildPhoto({ caption: 'Burnt diode 2 in the junction box', tag: 'before', modulePosition: 5 }))).toBe(
      'Burnt diode 2 in the junction box (before repair of INV07-MPPT3-S2, module 5)',
    );
  });

  it('falls back to the tag and the string without a caption', () => {
    expect(photoAlt(buildPhoto({ tag: 'thermal' }))).toBe('Thermal image of INV07-MPPT3-S2');
    expect(photoAlt(buildPhoto({ tag: 'nameplate', stringId: null, stringLabel: null }))).toBe('Nameplate');
  });
});
