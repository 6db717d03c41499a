/**
 * Content-addressed storage for raw samples: a blob's key is the SHA-256 (hex) of its
 * uncompressed bytes, so writing the same bytes twice stores them once and a key can be checked
 * against what it returns. A file tree today; an object store can implement the same interface.
 */
export interface BlobStore {
  /** Stores the bytes (if not already there) and returns their SHA-256 in lower-case hex. */
  put(bytes: Buffer): Promise<string>;
  /** The bytes stored under sha; throws when there are none or they no longer hash to sha. */
  get(sha256: string): Promise<Buffer>;
  has(sha256: string): Promise<boolean>;
}

const SHA256_HEX = /^[0-9a-f]{64}$/;

export function requireSha256(sha256: string): string {
  if (!SHA256_HEX.test(sha256)) throw new Error(`sha256 must be 64 lower-case hex digits, got ${JSON.stringify(sha256)}`);
  return sha256;
}

export class BlobNotFoundError extends Error {
  constructor(readonly sha256: string) {
    super(`No blob ${sha256} in the blob store.`);
  }
}
