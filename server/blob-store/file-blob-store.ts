import { createHash, randomUUID } from 'node:crypto';
import { access, mkdir, readFile, rename, rm, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { gunzip, gzip, constants } from 'node:zlib';
import { BlobNotFoundError, requireSha256, type BlobStore } from './blob-store.js';

const gzipAsync = promisify(gzip);
const gunzipAsync = promisify(gunzip);

// Sampled doubles compress only modestly; level 6 costs about a third of level 9's time for
// nearly the same size, and ingest waits for it.
const GZIP_LEVEL = constants.Z_DEFAULT_COMPRESSION;

export const sha256Hex = (bytes: Buffer): string => createHash('sha256').update(bytes).digest('hex');

/**
 * Blobs as gzip files under root/ab/cd/<sha256>. A blob is written to a temporary name and
 * renamed into place, so a reader never sees half a file and two writers of the same bytes
 * both end with the one complete file.
 */
export function fileBlobStore(rootDir: string): BlobStore {
  const pathOf = (sha256: string) => join(rootDir, sha256.slice(0, 2), sha256.slice(2, 4), sha256);
  const exists = async (path: string) => access(path).then(() => true, () => false);

  return {
    async put(bytes) {
      const sha256 = sha256Hex(bytes);
      const path = pathOf(sha256);
      if (await exists(path)) return sha256;
      await mkdir(join(path, '..'), { recursive: true });
      const temporary = `${path}.${randomUUID()}.tmp`;
      try {
        await writeFile(temporary, await gzipAsync(bytes, { level: GZIP_LEVEL }));
        await rename(temporary, path);
      } finally {
        await rm(temporary, { force: true });
      }
      return sha256;
    },
    async get(sha256) {
      const path = pathOf(requireSha256(sha256));
      const compressed = await readFile(path).catch((error: NodeJS.ErrnoException) => {
        throw error.code === 'ENOENT' ? new BlobNotFoundError(sha256) : error;
      });
      const bytes = await gunzipAsync(compressed);
      // The key is the content's hash, so a damaged or replaced file is detectable here.
      if (sha256Hex(bytes) !== sha256) throw new Error(`Blob ${sha256} is damaged: its content no longer hashes to its key.`);
      return bytes;
    },
    async has(sha256) {
      return exists(pathOf(requireSha256(sha256)));
    },
  };
}
