/** The storage driver contract, shared by every driver. */
export interface Storage {
  /** Writes the bytes under `key` (replacing what was there). */
  put(key: string, data: Uint8Array): Promise<void>;
  /** A stream of the stored bytes and their size, or null when nothing is stored under `key`. */
  get(key: string): Promise<{ stream: ReadableStream<Uint8Array>; size: number } | null>;
  /** Removes the file; removing a missing key is not an error. */
  delete(key: string): Promise<void>;
  exists(key: string): Promise<boolean>;
}

/** Keys are relative, slash-separated, of letters, digits, dot, dash and underscore; never "..". */
export function assertValidKey(key: string): void {
  if (!/^[A-Za-z0-9_-][A-Za-z0-9._-]*(\/[A-Za-z0-9_-][A-Za-z0-9._-]*)*$/.test(key) || key.split('/').includes('..')) {
    throw new Error(`Invalid storage key: ${JSON.stringify(key)}`);
  }
}
