import { createReadStream } from 'node:fs';
import { mkdir, rename, rm, stat, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { Readable } from 'node:stream';
import { randomBytes } from 'node:crypto';
import { assertValidKey, type Storage } from './keys';

/**
 * Files on the local disk under one folder. Writes go to a temporary name first and are renamed
 * into place, so a reader never sees half a file and a failed write leaves nothing behind.
 */
export class LocalDiskStorage implements Storage {
  constructor(readonly root: string) {}

  private pathOf(key: string): string {
    assertValidKey(key);
    const full = path.resolve(this.root, key);
    // assertValidKey already forbids "..", this is the belt to its braces.
    if (!full.startsWith(path.resolve(this.root) + path.sep)) throw new Error('Storage key escapes the storage folder');
    return full;
  }

  async put(key: string, data: Uint8Array): Promise<void> {
    const full = this.pathOf(key);
    await mkdir(path.dirname(full), { recursive: true });
    const temporary = `${full}.${randomBytes(6).toString('hex')}.part`;
    try {
      await writeFile(temporary, data);
      await rename(temporary, full);
    } catch (error) {
      await rm(temporary, { force: true });
      throw error;
    }
  }

  async get(key: string): Promise<{ stream: ReadableStream<Uint8Array>; size: number } | null> {
    const full = this.pathOf(key);
    let size: number;
    try {
      const info = await stat(full);
      if (!info.isFile()) return null;
      size = info.size;
    } catch {
      return null;
    }
    const stream = Readable.toWeb(createReadStream(full)) as ReadableStream<Uint8Array>;
    return { stream, size };
  }

  async delete(key: string): Promise<void> {
    await rm(this.pathOf(key), { force: true });
  }

  async exists(key: string): Promise<boolean> {
    try {
      return (await stat(this.pathOf(key))).isFile();
    } catch {
      return false;
    }
  }
}
