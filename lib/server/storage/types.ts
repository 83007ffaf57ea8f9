/** What the store knows about one stored file. */
export type StoredFileInfo = {
  key: string;
  sizeBytes: number;
  contentType: string;
};

/** A stored file with its bytes. */
export type StoredFile = StoredFileInfo & { bytes: Buffer };

/**
 * One interface for every place Rigline keeps uploaded files. Keys are made by us
 * (`newStorageKey`), never taken from a user's file name; a key that could leave the store's
 * root is refused with `StorageKeyError` by every driver.
 */
export interface FileStorage {
  /** Which driver this is ("disk" or "s3"), for logs and tests. */
  readonly driver: "disk" | "s3";
  /** Stores the bytes under the key, replacing what was there. */
  put(key: string, bytes: Uint8Array, contentType: string): Promise<StoredFileInfo>;
  /** The file, or null when nothing is stored under the key. */
  get(key: string): Promise<StoredFile | null>;
  /** Size and type without the bytes, or null when nothing is stored under the key. */
  head(key: string): Promise<StoredFileInfo | null>;
  /** Removes the file; removing a key that holds nothing is not an error. */
  delete(key: string): Promise<void>;
}
