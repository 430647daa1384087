import { randomUUID } from 'node:crypto';
import { mkdir, readdir, readFile, rename, rm, stat, writeFile } from 'node:fs/promises';
import { basename, join } from 'node:path';
import type { FileStorage, StagedFile } from './file-storage';

const SAFE_KEY = /^[a-z0-9][a-z0-9._-]{0,99}$/;
/** `<key>.<uuid>.tmp`: unique per write, so concurrent writes of one key never share a temporary file. */
const TEMP_NAME = /^([a-z0-9][a-z0-9._-]{0,99})\.[0-9a-f-]{36}\.tmp$/;

/** Files in a local folder, two-level fan-out by key prefix; writes are atomic (temp file + rename). */
export class LocalFileStorage implements FileStorage {
  constructor(private readonly folder: string) {}

  private pathOf(key: string): string {
    if (!SAFE_KEY.test(key)) throw new Error(`Unsafe storage key: ${key}`);
    return join(this.folder, key.slice(0, 2), key);
  }

  async put(key: string, data: Buffer): Promise<boolean> {
    return (await this.stage(key, data)).commit();
  }

  async stage(key: string, data: Buffer): Promise<StagedFile> {
    const path = this.pathOf(key);
    await mkdir(join(path, '..'), { recursive: true });
    const temp = `${path}.${randomUUID()}.tmp`;
    await writeFile(temp, data);
    return {
      commit: async () => {
        if (await this.exists(key)) {
          await rm(temp, { force: true });
          return false;
        }
        await rename(temp, path);
        return true;
      },
      discard: () => rm(temp, { force: true }),
    };
  }

  async sweep(isKept: (key: string) => Promise<boolean>): Promise<{ committed: number; removed: number }> {
    let committed = 0;
    let removed = 0;
    let folders: string[];
    try {
      folders = await readdir(this.folder);
    } catch {
      return { committed, removed };
    }
    for (const folder of folders) {
      let names: string[];
      try {
        names = await readdir(join(this.folder, folder));
      } catch {
        continue;
      }
      for (const name of names) {
        const match = TEMP_NAME.exec(basename(name));
        if (!match) continue;
        const temp = join(this.folder, folder, name);
        const key = match[1];
        if (!(await this.exists(key)) && (await isKept(key))) {
          await rename(temp, this.pathOf(key));
          committed++;
        } else {
          await rm(temp, { force: true });
          removed++;
        }
      }
    }
    return { committed, removed };
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
