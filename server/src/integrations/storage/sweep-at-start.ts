import type { Db } from '../../db/knex';
import { LocalFileStorage } from './local-file-storage';

/**
 * Run once before the server listens: temporary files a stopped process left behind are removed,
 * except those whose report row committed (the process stopped between commit and rename), which
 * are moved under their key.
 */
export async function sweepStorageAtStart(storageDir: string, db: Db): Promise<{ committed: number; removed: number }> {
  const storage = new LocalFileStorage(storageDir);
  return storage.sweep(async (key) => Boolean(await db('report_files').where({ storage_key: key }).first('id')));
}
