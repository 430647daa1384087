import { mkdir, readFile, rename, rm, stat, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { FileStorage } from './file-storage';

const SAFE_KEY = /^[a-z0-9][a-z0-9._-]{0,99}$/;

/** Files in a local folder, two-level fan-out by key prefix; writes are atomic (temp file + rename). */
export class LocalFileStorage implements FileStorage {
  constructor(private readonly folder: string) {}

  private pathOf(key: string): string {
    if (!SAFE_KEY.test(key)) throw new Error(`Unsafe storage key: ${key}`);
    return join(this.folder, key.slice(0, 2), key);
  }

  async put(key: string, data: Buffer): Promise<boolean> {
    if (await this.exists(key)) return false;
    const path = this.pathOf(key);
    await mkdir(join(path, '..'), { recursive: true });
    const temp = `${path}.${process.pid}.${Date.now()}.tmp`;
    await writeFile(temp, data);
    await rename(temp, path);
    return true;
  }

  get(key: string): Promise<Buffer> {
    return readFile(this.pathOf(key));
  }

  async exists(key: string): Promise<boolean> {
    try {
      await stat(this.pathOf(key));
      return true;
    } catch {
      return false;
    }
  }

  async delete(key: string): Promise<void> {
    await rm(this.pathOf(key), { force: true });
  }

  async move(from: string, to: string): Promise<void> {
    if (await this.exists(to)) return this.delete(from);
    const target = this.pathOf(to);
    await mkdir(join(target, '..'), { recursive: true });
    await rename(this.pathOf(from), target);
  }
}
