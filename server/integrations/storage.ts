import { randomUUID } from 'node:crypto';
import { mkdir, rm, writeFile } from 'node:fs/promises';
import path from 'node:path';

/**
 * Uploaded files on local disk, in UPLOADS_DIR (outside the web root). Names are made here (a
 * random UUID and the extension of the detected type), never taken from the client.
 */
export interface FileStorage {
  /** Writes the bytes under a new server-made key and returns it. */
  save(bytes: Uint8Array, extension: string): Promise<string>;
  /** Absolute path of a stored key, for sending. */
  pathOf(key: string): string;
  /** Removes a stored file; a file already gone is fine. */
  remove(key: string): Promise<void>;
}

const keyPattern = /^[0-9a-f-]{36}\.[a-z]{2,4}$/;

export function createFileStorage(uploadsDir: string): FileStorage {
  const root = path.resolve(uploadsDir);
  const pathOf = (key: string) => {
    if (!keyPattern.test(key)) throw new Error(`Not a storage key: ${key}`);
    return path.join(root, key);
  };
  return {
    async save(bytes, extension) {
      await mkdir(root, { recursive: true });
      const key = `${randomUUID()}.${extension}`;
      await writeFile(pathOf(key), bytes, { flag: 'wx' });
      return key;
    },
    pathOf,
    async remove(key) {
      await rm(pathOf(key), { force: true });
    },
  };
}
