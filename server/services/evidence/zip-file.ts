import archiver from 'archiver';
import { createHash } from 'node:crypto';
import { createReadStream, createWriteStream, type WriteStream } from 'node:fs';
import { once } from 'node:events';
import { PassThrough } from 'node:stream';
import { finished } from 'node:stream/promises';

export type WrittenFile = { bytes: number; sha256: string };

/** One entry being streamed into a zip: bytes in, compressed by zlib on the thread pool. */
export class ZipEntry {
  constructor(private readonly stream: PassThrough, private readonly failed: Promise<never>) {}

  /** Queues the bytes; resolves at once unless the zip is behind, then once it has caught up. */
  async write(chunk: string | Buffer): Promise<void> {
    if (!this.stream.write(chunk)) await Promise.race([once(this.stream, 'drain'), this.failed]);
  }

  /** Queues the bytes without waiting; the caller must `settle()` before queuing much more. */
  push(chunk: string | Buffer): void {
    this.stream.write(chunk);
  }

  async settle(): Promise<void> {
    if (this.stream.writableNeedDrain) await Promise.race([once(this.stream, 'drain'), this.failed]);
  }

  end(): void {
    this.stream.end();
  }
}

/**
 * A zip written to disk as a stream and hashed (SHA-256) as its bytes leave, so the file is never
 * read back to be hashed. Entries are written one after another in the order they are opened:
 * bytes for a later entry wait (bounded, through back-pressure) until the earlier ones end.
 */
export class ZipFile {
  private readonly archive: archiver.Archiver;
  private readonly out: WriteStream;
  private readonly hash = createHash('sha256');
  private bytes = 0;
  /** Rejects when the zip or the file fails; every wait races it so nothing hangs on a dead zip. */
  readonly failed: Promise<never>;

  constructor(path: string, deflateLevel: number) {
    this.archive = archiver('zip', { zlib: { level: deflateLevel } });
    this.out = createWriteStream(path);
    this.failed = new Promise<never>((_, reject) => {
      this.archive.on('error', reject);
      this.archive.on('warning', reject);
      this.out.on('error', reject);
    });
    this.failed.catch(() => undefined);
    this.archive.on('data', (chunk: Buffer) => {
      this.hash.update(chunk);
      this.bytes += chunk.length;
    });
    this.archive.pipe(this.out);
  }

  openEntry(name: string): ZipEntry {
    const stream = new PassThrough({ highWaterMark: 1 << 20 });
    this.archive.append(stream, { name });
    return new ZipEntry(stream, this.failed);
  }

  addText(name: string, text: string): void {
    this.archive.append(text, { name });
  }

  /** A file already compressed (a workbook) is stored as it is: deflating it again gains nothing. */
  addFile(path: string, name: string, options: { store: boolean }): void {
    this.archive.append(createReadStream(path), { name, store: options.store });
  }

  async finish(): Promise<WrittenFile> {
    await Promise.race([this.archive.finalize(), this.failed]);
    await Promise.race([finished(this.out), this.failed]);
    return { bytes: this.bytes, sha256: this.hash.digest('hex') };
  }

  /** Stops after a failure or a cancellation; the caller removes the file. */
  async abort(): Promise<void> {
    this.archive.abort();
    this.out.destroy();
    await finished(this.out).catch(() => undefined);
  }
}
