import ExcelJS from 'exceljs';
import { createHash } from 'node:crypto';
import { createWriteStream } from 'node:fs';
import { once } from 'node:events';
import { PassThrough, Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { WrittenFile } from '../zip-file.js';

/**
 * What a sheet held: its rows (header included) and, per column, how many cells had a value and
 * the first of them. The benchmark writes the same shape bare, as its ceiling.
 */
export type SheetShape = { name: string; headers: string[]; rows: number; filled: number[]; samples: Array<string | number | boolean | Date | null> };

/** The archiver that exceljs's WorkbookWriter keeps as `zip`: it writes entries one after another, in the order appended. */
type Zip = {
  append(source: unknown, data: unknown): unknown;
  abort(): unknown;
  on(event: 'error' | 'warning', listener: (error: Error) => void): unknown;
};
type SheetStream = { pipe(destination: NodeJS.WritableStream): unknown };

/** A sheet's bytes waiting for the zip beyond this make `settle()` wait. */
const backlogBytes = 1 << 20;

/**
 * The pack's workbook, streamed to disk by exceljs's WorkbookWriter (styles on for the number and
 * date formats, text in each cell rather than a shared-strings table, deflate level 1) and hashed
 * (SHA-256) as its bytes leave, so it is never read back. Tabs stand in the order sheets are
 * created; each sheet is written whole before the next is created, so one sheet at a time is open.
 *
 * Two things exceljs 4.4 does not do are added where its writer hands a sheet's stream to the zip
 * (WorkbookWriter._openStream calls `zip.append`): a sheet's entry may join the zip later than the
 * sheet is created, and a sheet's backlog is visible, so writing waits for the zip (exceljs's own
 * sheet stream takes every row without back-pressure).
 */
export class PackWorkbook {
  readonly writer: ExcelJS.stream.xlsx.WorkbookWriter;
  readonly shapes: SheetShape[] = [];
  private readonly output: Transform;
  private readonly written: Promise<void>;
  private readonly failed: Promise<never>;
  private readonly zip: Zip;
  /** archiver's own append, which the sheets' entries reach through the override below. */
  private readonly appendEntry: Zip['append'];
  private readonly hash = createHash('sha256');
  private bytes = 0;
  /** The sheet entry being written: its bytes wait here for the zip. */
  private backlog: PassThrough | undefined;
  private held: Array<[PassThrough, unknown]> | undefined;

  constructor(path: string, props: { creator: string; created: Date }) {
    this.output = new Transform({
      transform: (chunk: Buffer, _encoding, done) => {
        this.hash.update(chunk);
        this.bytes += chunk.length;
        done(null, chunk);
      },
    });
    this.written = pipeline(this.output, createWriteStream(path));
    // Level 1: on the benchmark's 416 MB Results sheet it gave 53.6 MB in 1.7 s of CPU, where
    // level 6 gave 43.2 MB in 5.0 s; the workbook is stored in the pack zip as it is.
    this.writer = new ExcelJS.stream.xlsx.WorkbookWriter({ stream: this.output, useStyles: true, useSharedStrings: false, zip: { zlib: { level: 1 } } });
    this.writer.creator = props.creator;
    this.writer.created = props.created;
    this.zip = (this.writer as unknown as { zip: Zip }).zip;
    const zip = this.zip;
    this.failed = new Promise<never>((_, reject) => {
      this.written.catch(reject);
      zip.on('error', reject);
      zip.on('warning', reject);
    });
    this.failed.catch(() => undefined); // raced below; this only keeps a failure nobody waits on from counting as unhandled
    const append = zip.append.bind(zip);
    this.appendEntry = append;
    zip.append = (source, data) => {
      if (typeof source === 'string' || Buffer.isBuffer(source)) return append(source, data);
      const backlog = new PassThrough({ highWaterMark: backlogBytes });
      (source as SheetStream).pipe(backlog);
      this.backlog = backlog;
      if (this.held) this.held.push([backlog, data]);
      else append(backlog, data);
      return zip;
    };
  }

  /** A new sheet, its header frozen; `shape` is kept up to date by whoever writes it. */
  addSheet(shape: SheetShape): ExcelJS.Worksheet {
    this.shapes.push(shape);
    return this.writer.addWorksheet(shape.name, { views: [{ state: 'frozen', ySplit: 1 }] });
  }

  /**
   * A sheet whose tab stands here but whose zip entry begins only at `start()`: for a first tab
   * that can only be written last. exceljs opens a sheet's entry as the sheet is created (the
   * WorksheetWriter constructor writes the sheet's opening XML), and the zip takes entries
   * strictly in turn, so an entry opened first and ended last would hold every later sheet in
   * memory. Nothing but that opening XML may be written before `start()`.
   */
  addSheetWrittenLater(shape: SheetShape): { sheet: ExcelJS.Worksheet; start: () => void } {
    const held: Array<[PassThrough, unknown]> = [];
    this.held = held;
    try {
      const sheet = this.addSheet(shape);
      return {
        sheet,
        start: () => {
          for (const [backlog, data] of held) {
            this.appendEntry(backlog, data);
            this.backlog = backlog;
          }
        },
      };
    } finally {
      this.held = undefined;
    }
  }

  /** Call between pages: waits while the sheet being written is more than a little ahead of the zip. */
  async settle(): Promise<void> {
    const backlog = this.backlog;
    if (backlog?.writableNeedDrain) await Promise.race([once(backlog, 'drain'), this.failed]);
  }

  async finish(): Promise<WrittenFile> {
    await Promise.race([this.writer.commit(), this.failed]);
    await this.written;
    return { bytes: this.bytes, sha256: this.hash.digest('hex') };
  }

  /** Stops after a failure or a cancellation; the caller removes the file. */
  async abort(): Promise<void> {
    this.zip.abort();
    this.output.destroy();
    await this.written.catch(() => undefined);
  }
}
