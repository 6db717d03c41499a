import type { FieldError } from '../../errors.js';
import type { ResultInput } from '../../schemas/test-run.js';
import type { ProductRef } from './reference-data.js';

/** A derived value and the raw-data field it came from, so a conflict or fault can name it. */
export type DerivedResult = { result: ResultInput; source: string };

/**
 * Collects derived values for the characteristics the product defines: a product without a
 * code simply gets no such result. Values carry the characteristic's own unit; `scale` converts
 * from the unit the analysis computes in.
 */
export class DerivedResults {
  readonly results: DerivedResult[] = [];
  readonly fields: FieldError[] = [];

  constructor(private readonly product: ProductRef) {}

  has(code: string): boolean {
    return this.product.characteristics.has(code);
  }

  add(code: string, value: number, source: string, scale: (unit: string) => number | null = () => 1): void {
    const characteristic = this.product.characteristics.get(code);
    if (!characteristic) return;
    const factor = scale(characteristic.unit);
    if (factor === null) {
      this.fields.push({ field: source, message: `${code} is kept in ${characteristic.unit}, which Fluxtrail cannot derive it in` });
      return;
    }
    this.results.push({ result: { characteristic: code, value: value * factor, unit: characteristic.unit }, source });
  }

  /** Runs one analysis; a rejected input becomes a field error instead of failing the whole request. */
  attempt(source: string, analysis: () => void): void {
    try {
      analysis();
    } catch (error) {
      if (!(error instanceof Error)) throw error;
      this.fields.push({ field: source, message: error.message });
    }
  }
}

const OHM_SCALE: Record<string, number> = { 'Ω': 1, 'mΩ': 1e3, 'µΩ': 1e6, 'μΩ': 1e6 };

/** From ohms to the characteristic's resistance unit. */
export const fromOhm = (unit: string): number | null => OHM_SCALE[unit] ?? null;
