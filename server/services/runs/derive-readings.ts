import {
  dielectricAbsorptionRatio, insulationResistanceAt40C, polarizationIndex, polarizationIndexMeaningful,
  unbalancePercent, windingResistanceAt,
} from '../../analysis/index.js';
import type { InsulationReading, WindingResistanceReading } from '../../schemas/raw-data.js';
import { fromOhm, type DerivedResults } from './derived-result.js';
import type { ProductRef } from './reference-data.js';

/**
 * Insulation characteristics (IEEE Std 43-2013): ir_40c from the 1-min reading corrected to
 * 40 °C, dar = R60s/R30s, pi = R10min/R1min (R1min defaults to the 1-min reading). PI is left
 * out when the 1-min IR at 40 °C is above 5000 MΩ, where IEEE 43 lets it be disregarded.
 * Safety: Fluxtrail records and judges these results; it does not drive the test.
 */
export function deriveInsulation(reading: InsulationReading, field: string, derived: DerivedResults): void {
  derived.attempt(field, () => {
    const at40C = insulationResistanceAt40C(reading);
    derived.add('ir_40c', at40C, field);
    if (reading.r30sMegohm !== undefined && reading.r60sMegohm !== undefined) {
      derived.add('dar', dielectricAbsorptionRatio({ r30sMegohm: reading.r30sMegohm, r60sMegohm: reading.r60sMegohm }), field);
    }
    const r1MinMegohm = reading.r1MinMegohm ?? reading.resistanceMegohm;
    if (reading.r10MinMegohm !== undefined && polarizationIndexMeaningful(insulationResistanceAt40C({ resistanceMegohm: r1MinMegohm, windingTempC: reading.windingTempC }))) {
      derived.add('pi', polarizationIndex({ r1MinMegohm, r10MinMegohm: reading.r10MinMegohm }), field);
    }
  });
}

// r_u_20c: phase U's resistance referred to 20 °C; the code itself names the reference temperature.
const PHASE_RESISTANCE_CODE = /^r_([uvw])_(\d+)c$/;
const PHASE_FIELD = { u: 'uOhm', v: 'vOhm', w: 'wOhm' } as const;

/**
 * Phase resistances referred to each characteristic's reference temperature (IEC 60034-1,
 * k = 235 copper / 225 aluminium) and r_unbalance, the NEMA MG 1 unbalance of the three (the
 * same at any one temperature, since the correction scales every phase alike).
 */
export function deriveWindingResistance(product: ProductRef, reading: WindingResistanceReading, field: string, derived: DerivedResults): void {
  derived.attempt(field, () => {
    for (const code of product.characteristics.keys()) {
      const match = PHASE_RESISTANCE_CODE.exec(code);
      if (!match) continue;
      const phase = match[1] as keyof typeof PHASE_FIELD;
      const resistanceOhm = windingResistanceAt({
        resistanceOhm: reading[PHASE_FIELD[phase]], measuredTempC: reading.windingTempC,
        referenceTempC: Number(match[2]), material: product.windingMaterial,
      });
      derived.add(code, resistanceOhm, `${field}.${PHASE_FIELD[phase]}`, fromOhm);
    }
    if (derived.has('r_unbalance')) derived.add('r_unbalance', unbalancePercent([reading.uOhm, reading.vOhm, reading.wOhm]), field);
  });
}
