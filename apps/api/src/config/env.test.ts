import { describe, expect, it } from 'vitest';
import { parseEnv } from './env.ts';

const s3 = {
  S3_ENDPOINT: 'http://127.0.0.1:4568',
  S3_BUCKET: 'stringfield-evidence',
  S3_ACCESS_KEY_ID: 'AKIDEXAMPLE',
  S3_SECRET_ACCESS_KEY: 'secret-example',
};

describe('S3 configuration', () => {
  it('keeps uploads on local disk when no S3_* variable is set (or all are empty)', () => {
    expect(parseEnv({}).s3).toBeNull();
    expect(parseEnv({ S3_BUCKET: '', S3_ENDPOINT: '' }).s3).toBeNull();
  });

  it('uses S3 when all four are set, with region us-east-1 and virtual-host style by default', () => {
    expect(parseEnv(s3).s3).toEqual({
      endpoint: s3.S3_ENDPOINT,
      bucket: s3.S3_BUCKET,
      region: 'us-east-1',
      accessKeyId: s3.S3_ACCESS_KEY_ID,
      secretAccessKey: s3.S3_SECRET_ACCESS_KEY,
      forcePathStyle: false,
    });
    expect(parseEnv({ ...s3, S3_REGION: 'eu-central-1', S3_FORCE_PATH_STYLE: 'true' }).s3).toMatchObject({
      region: 'eu-central-1',
      forcePathStyle: true,
    });
  });

  it.each([
    [
      'only a bucket',
      { S3_BUCKET: 'stringfield-evidence' },
      'S3_ENDPOINT, S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY',
    ],
    ['no secret', { ...s3, S3_SECRET_ACCESS_KEY: undefined }, 'S3_SECRET_ACCESS_KEY'],
    [
      'only a region',
      { S3_REGION: 'eu-central-1' },
      'S3_ENDPOINT, S3_BUCKET, S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY',
    ],
  ])('refuses to start with %s, naming what is missing', (_what, source, missing) => {
    expect(() => parseEnv(source)).toThrow(`S3 storage is only partly configured; also set ${missing},`);
  });

  it('refuses an endpoint that is not a URL and a bucket name S3 would refuse', () => {
    expect(() => parseEnv({ ...s3, S3_ENDPOINT: 'minio:9000' })).toThrow(/S3_ENDPOINT must be a URL/);
    expect(() => parseEnv({ ...s3, S3_BUCKET: 'Evidence_Bucket' })).toThrow(/S3_BUCKET: 3 to 63/);
  });
});
