import type { Photo } from '@stringfield/shared';

/** A stored photo with sensible values; override what the test is about. */
export function buildPhoto(overrides: Partial<Photo> = {}): Photo {
  const id = overrides.id ?? 1;
  return {
    id,
    workOrderId: 15,
    stringId: 154,
    stringLabel: 'INV07-MPPT3-S2',
    modulePosition: null,
    tag: 'before',
    caption: '',
    width: 4000,
    height: 3000,
    bytes: 2_400_000,
    sha256: 'a'.repeat(64),
    capturedAt: null,
    gps: null,
    uploadedBy: { id: 3, name: 'Demo Technician' },
    createdAt: `2026-12-01T10:00:0${id % 10}.000Z`,
    urls: { thumb: `/api/photos/${id}/thumb`, screen: `/api/photos/${id}/screen`, original: `/api/photos/${id}/original` },
    thermal: null,
    ...overrides,
  };
}
