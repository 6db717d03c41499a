import { createHash } from 'node:crypto';
import type { ZipEntry } from './zip-file.js';
import type { MeasurementRow, PackRun } from './read-pack-runs.js';
import { csvField, csvLine } from './safe-text.js';

export const csvHeader = ['serial', 'run_id', 'attempt', 'characteristic', 'value', 'unit', 'lsl', 'usl', 'verdict', 'station', 'operator_badge', 'started_at_utc'];

export type CharacteristicFacts = { code: string; unit: string; sortOrder: number };
export type WrittenCsv = { rows: number; bytes: number; sha256: string };

/**
 * Text is handed to the zip in pieces of about this many characters. Small pieces matter: V8
 * turns a long `+=` string into bytes ten times slower than many short ones (measured with
 * 2 MB against 64 KB pieces), and short ones die young instead of burdening the old heap.
 */
const flushChars = 1 << 16;

const number = (value: number | null) => (value === null ? '' : csvField(value));

/**
 * The long-format CSV (one line per measurement, UTF-8, RFC 4180) streamed straight into its zip
 * entry and hashed on the way, so it is neither kept on disk nor read back. A run's lines follow
 * the test plan (sort order, then id).
 */
export class PackCsv {
  private readonly hash = createHash('sha256');
  private text = '';
  private rows = 0;
  private bytes = 0;
  /** Per characteristic: the quoted code and unit, and where it sorts in a test plan. */
  private readonly fields = new Map<number, { code: string; unit: string; order: number }>();
  private readonly verdicts = new Map<string, string>();

  constructor(private readonly entry: ZipEntry, characteristics: ReadonlyMap<number, CharacteristicFacts>) {
    for (const [id, c] of characteristics) {
      this.fields.set(id, { code: `${csvField(c.code)},`, unit: `,${csvField(c.unit)},`, order: c.sortOrder * 1e9 + id });
    }
    this.text = csvLine(csvHeader);
  }

  /** Adds a run's lines; they go to the zip in short pieces, and `settle()` waits for it to catch up. */
  addRun(run: PackRun): void {
    const head = `${csvField(run.serial)},${csvField(run.uuid)},${run.attempt},`;
    const tail = `,${csvField(run.station)},${csvField(run.operatorBadge)},${run.startedAt.toISOString()}\r\n`;
    for (const m of this.inPlanOrder(run.measurements)) {
      const field = this.fields.get(m[1]);
      if (!field) throw new Error(`measurement of unknown characteristic ${m[1]}`);
      this.text += `${head}${field.code}${number(m[2])}${field.unit}${number(m[3])},${number(m[4])},${this.verdict(m[5])}${tail}`;
      if (this.text.length > flushChars) this.flush();
    }
    this.rows += run.measurements.length;
  }

  /** Hands the text so far to the zip, hashing it, and waits while the zip is behind. */
  async settle(): Promise<void> {
    this.flush();
    await this.entry.settle();
  }

  finish(): WrittenCsv {
    this.flush();
    this.entry.end();
    return { rows: this.rows, bytes: this.bytes, sha256: this.hash.digest('hex') };
  }

  private flush(): void {
    if (this.text.length === 0) return;
    const bytes = Buffer.from(this.text, 'utf8');
    this.text = '';
    this.hash.update(bytes);
    this.bytes += bytes.length;
    this.entry.push(bytes);
  }

  /** Stored order (characteristic id) is usually the plan's already; sort only when it is not. */
  private inPlanOrder(measurements: MeasurementRow[]): MeasurementRow[] {
    const order = (m: MeasurementRow) => this.fields.get(m[1])?.order ?? Number.MAX_VALUE;
    for (let i = 1; i < measurements.length; i++) {
      if (order(measurements[i - 1]) > order(measurements[i])) return [...measurements].sort((a, b) => order(a) - order(b));
    }
    return measurements;
  }

  private verdict(verdict: string): string {
    let field = this.verdicts.get(verdict);
    if (field === undefined) {
      field = csvField(verdict);
      this.verdicts.set(verdict, field);
    }
    return field;
  }
}
