/**
 * Where uploaded bytes are kept. Keys are chosen by the caller (content hashes), so the same bytes
 * are stored once. The local folder adapter is the default; an object store implements the same
 * methods.
 */
export interface FileStorage {
  /** Stores `data` under `key`; resolves to false when the key held the same bytes already. */
  put(key: string, data: Buffer): Promise<boolean>;
  /**
   * Writes `data` under a unique temporary name. The caller commits it (moves it under `key`) once
   * its database transaction committed, or discards it; what neither happened to is swept at start-up.
   */
  stage(key: string, data: Buffer): Promise<StagedFile>;
  /** Removes temporary files left by a stopped process; keeps (commits) those whose key `isKept`. */
  sweep(isKept: (key: string) => Promise<boolean>): Promise<{ committed: number; removed: number }>;
  get(key: string): Promise<Buffer>;
  exists(key: string): Promise<boolean>;
  delete(key: string): Promise<void>;
  /** Renames `from` to `to` (replacing nothing: when `to` exists already, `from` is dropped). */
  move(from: string, to: string): Promise<void>;
}

export interface StagedFile {
  /** Moves the bytes under their key; resolves to false when the key held them already. */
  commit(): Promise<boolean>;
  discard(): Promise<void>;
}
