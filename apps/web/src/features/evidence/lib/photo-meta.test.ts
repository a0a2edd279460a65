import { describe, expect, it } from 'vitest';
import { buildPhotoMeta, fileProblem, progressPercent, type PhotoDraft } from './photo-meta';

const draft = (overrides: Partial<PhotoDraft> = {}): PhotoDraft => ({ tag: 'after', stringId: '154', modulePosition: '', caption: '', ...overrides });

describe('buildPhotoMeta', () => {
  it('builds the meta entry of an after photo of a string', () => {
    expect(buildPhotoMeta(draft({ modulePosition: ' 5 ', caption: '  New diode fitted ' }))).toEqual({
      ok: true,
      meta: { tag: 'after', stringId: 154, modulePosition: 5, caption: 'New diode fitted' },
    });
  });

  it('sends null for a photo tied to no string and no module', () => {
    expect(buildPhotoMeta(draft({ tag: 'nameplate', stringId: '' }))).toEqual({ ok: true, meta: { tag: 'nameplate', stringId: null, modulePosition: null, caption: '' } });
  });

  it('asks for the tag before anything is sent', () => {
    const result = buildPhotoMeta(draft({ tag: '' }));
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.errors.tag).toMatch(/Tag each photo/);
  });

  it.each([
    ['2.5', 'Module position must be a whole number'],
    ['five', 'Module position must be a whole number'],
    ['0', 'Module positions count from 1 at the + end'],
    ['101', 'Module position can be at most 100'],
  ])('refuses module position %j with “%s”', (modulePosition, message) => {
    const result = buildPhotoMeta(draft({ modulePosition }));
    expect(result).toEqual({ ok: false, errors: { modulePosition: message } });
  });

  it('wants the string when a module position is given', () => {
    expect(buildPhotoMeta(draft({ stringId: '', modulePosition: '3' }))).toEqual({ ok: false, errors: { stringId: 'Choose the string the module is on' } });
  });

  it('limits the caption to 300 characters', () => {
    const result = buildPhotoMeta(draft({ caption: 'x'.repeat(301) }));
    expect(result.ok).toBe(false);
  });
});

describe('fileProblem', () => {
  const MB = 1024 * 1024;
  it('accepts a phone JPEG', () => {
    expect(fileProblem({ name: 'IMG_0412.jpg', type: 'image/jpeg', size: 4 * MB })).toBeNull();
  });

  it.each([
    { name: 'IMG_0413.HEIC', type: '' },
    { name: 'photo', type: 'image/heic' },
    { name: 'burst.heif', type: 'image/heif-sequence' },
  ])('refuses HEIC ($name, “$type”) plainly, with the camera setting that fixes it', (file) => {
    expect(fileProblem({ ...file, size: 3 * MB })).toMatch(/is HEIC, which Stringfield cannot decode yet\. Set the phone camera to "Most compatible"/);
  });

  it('refuses files over 25 MB and other formats', () => {
    expect(fileProblem({ name: 'pano.jpg', type: 'image/jpeg', size: 26 * MB })).toBe('pano.jpg is 26 MB; the limit is 25 MB per photo.');
    expect(fileProblem({ name: 'scan.tiff', type: 'image/tiff', size: MB })).toBe('scan.tiff is not a JPEG, PNG or WebP photo.');
  });
});

describe('progressPercent', () => {
  it('rounds to whole percent and stays within 0–100', () => {
    expect(progressPercent(512, 2048)).toBe(25);
    expect(progressPercent(3000, 2048)).toBe(100);
  });
  it('is unknown when the browser gives no total', () => {
    expect(progressPercent(512, undefined)).toBeNull();
  });
});
