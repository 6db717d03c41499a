import type { FieldError } from '../../errors.js';
import { judge } from '../../analysis/verdict.js';
import type { JudgedResult, ResultInput, Verdict } from '../../schemas/test-run.js';
import type { CharacteristicRef, LimitRow, ProductRef } from './reference-data.js';

export type ResolvedResult = JudgedResult & { characteristicId: number };
export type LabelledResult = { result: ResultInput; field: string };

/** Each result must name a characteristic of the product and carry exactly its unit. */
export function checkResults(results: readonly LabelledResult[], product: ProductRef): FieldError[] {
  const fields: FieldError[] = [];
  for (const { result, field } of results) {
    const characteristic = product.characteristics.get(result.characteristic);
    if (!characteristic) {
      fields.push({ field: `${field}.characteristic`, message: `${result.characteristic} is not a characteristic of product ${product.code}` });
    } else if (characteristic.unit !== result.unit) {
      fields.push({ field: `${field}.unit`, message: `${result.characteristic} is measured in ${characteristic.unit}, not ${result.unit}` });
    }
  }
  return fields;
}

/**
 * Judges checked results against one limit revision. A characteristic without a limit row in that
 * revision has no limits and passes; the run fails when any result fails.
 */
export function judgeRun(results: readonly ResultInput[], product: ProductRef, limits: ReadonlyMap<number, LimitRow>): { verdict: Verdict; results: ResolvedResult[] } {
  const judged = results.map((result) => {
    const characteristic = product.characteristics.get(result.characteristic) as CharacteristicRef;
    const limit = limits.get(characteristic.id);
    const lsl = limit?.lsl ?? null;
    const usl = limit?.usl ?? null;
    return {
      characteristicId: characteristic.id, characteristic: result.characteristic, value: result.value, unit: result.unit,
      lsl, usl, verdict: judge(result.value, { lsl, usl }),
    };
  });
  return { verdict: judged.every((r) => r.verdict === 'pass') ? 'pass' : 'fail', results: judged };
}
