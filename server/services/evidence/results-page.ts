import type { PackRun } from './read-pack-runs.js';

/** A run's facts as its Results row shows them, without its measurements. */
export type RunFacts = Omit<PackRun, 'id' | 'measurements'>;

/**
 * A page of one product's runs for its Results sheet, as it crosses from the pack's worker thread
 * to the thread writing the workbook: per run and characteristic column, a value and a verdict in
 * flat typed arrays, which cross as bytes rather than as thousands of small arrays. Verdict code 0
 * marks a characteristic the run did not measure.
 */
export type ResultsPage = {
  runs: RunFacts[];
  /** Measurements behind the page, for progress. */
  measurements: number;
  values: Float64Array;
  verdicts: Uint8Array;
  /** Verdict text by code; code 0 is "not measured". */
  verdictNames: string[];
};

/** Gives each distinct verdict text a small code, the same for the whole pack. */
export class VerdictCodes {
  readonly names: string[] = [''];
  private readonly codes = new Map<string, number>();

  code(verdict: string): number {
    let code = this.codes.get(verdict);
    if (code === undefined) {
      code = this.names.length;
      if (code > 255) throw new Error('more than 255 distinct measurement verdicts');
      this.codes.set(verdict, code);
      this.names.push(verdict);
    }
    return code;
  }
}

/**
 * Lays a page of runs out by the product's characteristic columns (`column`: characteristic id to
 * column index). A characteristic outside the product's plan has no column and is left out, and
 * if a run holds a characteristic twice the later value stands, as a row has one cell for it.
 */
export function toResultsPage(runs: readonly PackRun[], column: ReadonlyMap<number, number>, verdicts: VerdictCodes): ResultsPage {
  const width = column.size;
  const page: ResultsPage = {
    runs: [], measurements: 0, values: new Float64Array(runs.length * width),
    verdicts: new Uint8Array(runs.length * width), verdictNames: verdicts.names,
  };
  runs.forEach((run, r) => {
    const { id: _id, measurements, ...facts } = run;
    page.runs.push(facts);
    page.measurements += measurements.length;
    for (const m of measurements) {
      const index = column.get(m[1]);
      if (index === undefined) continue;
      page.values[r * width + index] = m[2];
      page.verdicts[r * width + index] = verdicts.code(m[5]);
    }
  });
  return page;
}
