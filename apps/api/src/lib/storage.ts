import fs from 'node:fs/promises';
import path from 'node:path';
import { env } from '../config/env.ts';

/** Where uploaded files live. Keys are ours (never user input), like `photos/2026/12/abc.jpg`. */
export interface FileStorage {
  put(key: string, data: Buffer, contentType: string): Promise<void>;
  get(key: string): Promise<Buffer>;
  delete(key: string): Promise<void>;
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

  get(key: string): Promise<Buffer> {
    return fs.readFile(this.resolve(key));
  }

  async delete(key: string): Promise<void> {
    await fs.rm(this.resolve(key), { force: true });
  }
}

export const storage: FileStorage = new LocalDiskStorage(env.UPLOADS_DIR);
