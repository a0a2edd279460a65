// Used by scripts/backup.mjs when uploads live in an S3-compatible bucket (S3_* set):
//   tsx apps/api/src/cli/bucket-copy.ts export DIR INDEX   every object of the bucket → DIR/<key>, and
//                                                          INDEX (JSON: key → content type)
//   tsx apps/api/src/cli/bucket-copy.ts import DIR INDEX   every file listed in INDEX → the bucket
// Prints the number of objects; exits 1 with a message on any failure. Local-disk storage is copied by
// the backup script itself, so without S3_* this refuses.
import fs from 'node:fs/promises';
import path from 'node:path';
import { GetObjectCommand, ListObjectsV2Command, PutObjectCommand } from '@aws-sdk/client-s3';
import { env } from '../config/env.ts';
import { s3Client } from '../lib/storage.ts';

const [cmd, dirArg, indexArg] = process.argv.slice(2);
if (!env.s3) throw new Error('Uploads are on local disk (no S3_* configured): nothing to copy from a bucket.');
if ((cmd !== 'export' && cmd !== 'import') || !dirArg || !indexArg) throw new Error('Use: bucket-copy.ts export|import DIR INDEX');
const dir = path.resolve(dirArg);
const { bucket } = env.s3;
const client = s3Client(env.s3);

/** The file of an object key; keys are ours (`photos/2026/12/…`), but a backup folder is not trusted. */
function fileOf(key: string): string {
  const file = path.resolve(dir, key);
  if (!file.startsWith(dir + path.sep)) throw new Error(`Object key outside the backup folder: ${key}`);
  return file;
}

async function exportBucket(): Promise<number> {
  const index: Record<string, string> = {};
  let token: string | undefined;
  do {
    const page = await client.send(new ListObjectsV2Command({ Bucket: bucket, ContinuationToken: token }));
    for (const { Key } of page.Contents ?? []) {
      if (!Key) continue;
      const object = await client.send(new GetObjectCommand({ Bucket: bucket, Key }));
      const file = fileOf(Key);
      await fs.mkdir(path.dirname(file), { recursive: true });
      await fs.writeFile(file, await object.Body!.transformToByteArray());
      index[Key] = object.ContentType ?? 'application/octet-stream';
    }
    token = page.IsTruncated ? page.NextContinuationToken : undefined;
  } while (token);
  await fs.writeFile(indexArg!, `${JSON.stringify(index, null, 2)}\n`);
  return Object.keys(index).length;
}

async function importBucket(): Promise<number> {
  const index = JSON.parse(await fs.readFile(indexArg!, 'utf8')) as Record<string, string>;
  for (const [Key, ContentType] of Object.entries(index)) {
    await client.send(new PutObjectCommand({ Bucket: bucket, Key, Body: await fs.readFile(fileOf(Key)), ContentType }));
  }
  return Object.keys(index).length;
}

try {
  const n = cmd === 'export' ? await exportBucket() : await importBucket();
  process.stdout.write(`${n}\n`);
} catch (err) {
  process.stderr.write(`${cmd === 'export' ? 'Reading' : 'Writing'} bucket ${bucket} failed: ${(err as Error).message}\n`);
  process.exitCode = 1;
}
