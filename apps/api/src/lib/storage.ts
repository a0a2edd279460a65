import fs from 'node:fs/promises';
import path from 'node:path';
import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client, S3ServiceException } from '@aws-sdk/client-s3';
import { getSignedUrl } from '@aws-sdk/s3-request-presigner';
import { env, type Env, type S3Config } from '../config/env.ts';
import { AppError, notFound } from './app-error.ts';
import { logger } from './logger.ts';

/** Where uploaded files live. Keys are ours (never user input), like `photos/2026/12/abc.jpg`. */
export interface FileStorage {
  put(key: string, data: Buffer, contentType: string): Promise<void>;
  get(key: string): Promise<Buffer>;
  delete(key: string): Promise<void>;
  /**
   * A URL that lets the holder read one file for `expiresInS` seconds. Only storages that can sign have it;
   * without it the API streams the bytes itself.
   */
  signedUrl?(key: string, options: { expiresInS: number; contentType: string }): Promise<string>;
}

/** Local disk under UPLOADS_DIR (.data/uploads by default); files are served only through the API. */
export class LocalDiskStorage implements FileStorage {
  constructor(private readonly root: string) {}

  private resolve(key: string): string {
    const full = path.resolve(this.root, key);
    if (!full.startsWith(path.resolve(this.root) + path.sep)) throw new Error(`Storage key escapes the root: ${key}`);
    return full;
  }

  async put(key: string, data: Buffer): Promise<void> {
    const full = this.resolve(key);
    await fs.mkdir(path.dirname(full), { recursive: true });
    await fs.writeFile(`${full}.part`, data);
    await fs.rename(`${full}.part`, full);
  }

  async get(key: string): Promise<Buffer> {
    try {
      return await fs.readFile(this.resolve(key));
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code === 'ENOENT') throw notFound('That file');
      throw err;
    }
  }

  async delete(key: string): Promise<void> {
    await fs.rm(this.resolve(key), { force: true });
  }
}

/** The SDK client for a configured bucket (the API's storage and the backup's bucket copy share it). */
export function s3Client(config: S3Config): S3Client {
  return new S3Client({
    endpoint: config.endpoint,
    region: config.region,
    forcePathStyle: config.forcePathStyle,
    credentials: { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey },
    // Since 3.729 the SDK adds CRC32 checksums to every PutObject; some S3-compatible stores (older MinIO,
    // Dell ECS, Backblaze B2) refuse them. Send and check them only where the S3 API requires them.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    maxAttempts: 3,
    requestHandler: { connectionTimeout: 5_000, requestTimeout: 30_000 },
  });
}

/** An S3-compatible bucket (AWS, MinIO, Ceph …); the bucket stays private and reads go through signed URLs. */
export class S3Storage implements FileStorage {
  private readonly client: S3Client;
  private readonly bucket: string;

  constructor(config: S3Config) {
    this.bucket = config.bucket;
    this.client = s3Client(config);
  }

  private async send<T>(what: string, key: string, run: () => Promise<T>): Promise<T> {
    try {
      return await run();
    } catch (err) {
      if (err instanceof S3ServiceException && (err.name === 'NoSuchKey' || err.$metadata.httpStatusCode === 404)) throw notFound('That file');
      logger.warn({ err: (err as Error).message, name: (err as Error).name, key }, `object storage ${what} failed`);
      throw new AppError('UNAVAILABLE', 'File storage is not answering right now. Try again in a minute.');
    }
  }

  async put(key: string, data: Buffer, contentType: string): Promise<void> {
    await this.send('put', key, () => this.client.send(new PutObjectCommand({ Bucket: this.bucket, Key: key, Body: data, ContentType: contentType })));
  }

  async get(key: string): Promise<Buffer> {
    return this.send('get', key, async () => {
      const out = await this.client.send(new GetObjectCommand({ Bucket: this.bucket, Key: key }));
      if (!out.Body) throw new Error('empty response body');
      return Buffer.from(await out.Body.transformToByteArray());
    });
  }

  async delete(key: string): Promise<void> {
    await this.send('delete', key, () => this.client.send(new DeleteObjectCommand({ Bucket: this.bucket, Key: key })));
  }

  /** Signing is local (no request to the store); the URL names the bucket endpoint, never a public one. */
  signedUrl(key: string, { expiresInS, contentType }: { expiresInS: number; contentType: string }): Promise<string> {
    const command = new GetObjectCommand({ Bucket: this.bucket, Key: key, ResponseContentType: contentType, ResponseContentDisposition: 'inline' });
    return getSignedUrl(this.client, command, { expiresIn: expiresInS });
  }
}

/** S3 when S3_* is configured, else local disk; chosen once when the process starts. */
export function createStorage(config: Pick<Env, 's3' | 'UPLOADS_DIR'>): FileStorage {
  return config.s3 ? new S3Storage(config.s3) : new LocalDiskStorage(config.UPLOADS_DIR);
}

export const storage: FileStorage = createStorage(env);
