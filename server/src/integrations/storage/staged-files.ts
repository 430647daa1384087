import { randomBytes } from 'node:crypto';
import type { FileStorage } from './file-storage';

/**
 * Files written under a temporary name during a transaction and given their real name only once it
 * committed: `stage` during the work, then `keep` after commit or `discard` after a rollback.
 */
export class StagedFiles {
  private readonly staged: { temp: string; key: string }[] = [];

  constructor(private readonly storage: FileStorage) {}

  async stage(key: string, data: Buffer): Promise<void> {
    const temp = `tmp-${randomBytes(12).toString('hex')}`;
    await this.storage.put(temp, data);
    this.staged.push({ temp, key });
  }

  async keep(): Promise<void> {
    for (const { temp, key } of this.staged.splice(0)) await this.storage.move(temp, key);
  }

  async discard(): Promise<void> {
    for (const { temp } of this.staged.splice(0)) await this.storage.delete(temp);
  }

  /** Runs `work`, keeping the staged files when it succeeds and dropping them when it fails. */
  static async around<T>(storage: FileStorage, work: (files: StagedFiles) => Promise<T>): Promise<T> {
    const files = new StagedFiles(storage);
    try {
      const result = await work(files);
      await files.keep();
      return result;
    } catch (err) {
      await files.discard();
      throw err;
    }
  }
}
