/** A stored file's address and fingerprint, recorded beside the record that owns it. */
export interface StoredFile {
  /** server-generated name; never derived from the uploader's file name */
  key: string
  /** hex SHA-256 of the bytes as received */
  sha256: string
  size: number
}

/**
 * Where uploaded files live. The local folder serves one server; an S3-compatible object store can
 * implement the same interface when the product runs on several.
 */
export interface FileStorage {
  put(bytes: Uint8Array): Promise<StoredFile>
  /** stores a copy of a file on local disk (an upload's temporary file) without loading it whole */
  putFile(path: string): Promise<StoredFile>
  /** the bytes, after checking them against the SHA-256 recorded when they were stored */
  read(file: Pick<StoredFile, 'key' | 'sha256'>): Promise<Buffer>
  remove(key: string): Promise<void>
  /**
   * Removes what a crash may have left: half-written files and stored files no record names
   * (`isKnown` answers from the database). Run at start, before requests arrive.
   */
  sweep(isKnown: (keys: string[]) => Promise<Set<string>>): Promise<number>
}
