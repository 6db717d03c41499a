import type { ResultInput } from '../../server/schemas/test-run.js';
import type { FaultKind } from './faults.js';
import { demoProducts, type DemoProductCode } from './products.js';
import type { MotorContext, MotorModel } from './values/shared.js';
import { pm150Motor } from './values/pm150.js';
import { im4pMotor } from './values/im4p.js';
import { dc24aMotor } from './values/dc24a.js';

const models: Record<DemoProductCode, (context: MotorContext) => MotorModel> = {
  'PM-150': pm150Motor, 'IM-4P': im4pMotor, 'DC-24A': dc24aMotor,
};

const unitsByProduct = new Map(demoProducts.map((p) => [p.code, new Map(p.characteristics.map((c) => [c.code, c.unit]))]));

/** A simulated motor of a product that yields one run's results, in the product's test order. */
export function simulateMotor(productCode: DemoProductCode, context: MotorContext): { measure(faults: ReadonlySet<FaultKind>): ResultInput[] } {
  const model = models[productCode](context);
  const units = unitsByProduct.get(productCode) as Map<string, string>;
  return {
    measure(faults) {
      const values = model.measure(faults);
      return [...units].map(([characteristic, unit]) => ({ characteristic, unit, value: values[characteristic] }));
    },
  };
}
