/**
 * Where uploaded bytes are kept. Keys are chosen by the caller (content hashes), so the same bytes
 * are stored once. The local folder adapter is the default; an object store implements the same four
 * methods.
 */
export interface FileStorage {
  /** Stores `data` under `key`; resolves to false when the key held the same bytes already. */
  put(key: string, data: Buffer): Promise<boolean>;
  get(key: string): Promise<Buffer>;
  exists(key: string): Promise<boolean>;
  delete(key: string): Promise<void>;
  /** Renames `from` to `to` (replacing nothing: when `to` exists already, `from` is dropped). */
  move(from: string, to: string): Promise<void>;
}
