import type { Knex } from 'knex';
import { hipotTestVoltage } from '../../analysis/electrical/index.js';
import { invalid } from '../../errors.js';
import { findProductRow } from './product-rows.js';

/**
 * The withstand voltage IEC 60034-1 gives for the product's rating. Fluxtrail shows it as the
 * standard's figure; the site's electrical-safety procedures govern how a stand applies it.
 */
export async function productHipotVoltage(db: Knex, productCode: string) {
  const product = await findProductRow(db, productCode);
  try {
    const voltage = hipotTestVoltage({ ratedVoltageV: product.rated_voltage_v, ratedPowerKw: product.rated_power_kw });
    return { productCode, ratedVoltageV: product.rated_voltage_v, ratedPowerKw: product.rated_power_kw, ...voltage };
  } catch (error) {
    // The rating is outside the table the function implements (e.g. 10 MW and above).
    throw invalid([{ field: 'ratedPowerKw', message: (error as Error).message }], `No standard hipot voltage for product ${productCode}.`);
  }
}
