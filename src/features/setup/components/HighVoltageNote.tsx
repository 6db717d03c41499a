import { HighVoltageCaution } from '../../../components/HighVoltageCaution';
import type { Characteristic } from '../api/setup-schemas';

const highVoltageSteps = /hipot|insulation|dielectric|withstand/i;

/** The caution, shown only when some of these characteristics belong to a hipot or insulation step. */
export function HighVoltageNote({ characteristics }: { characteristics: Characteristic[] }) {
  const steps = [...new Set(characteristics.filter((c) => highVoltageSteps.test(c.testStep)).map((c) => c.testStep))];
  if (steps.length === 0) return null;
  return <HighVoltageCaution context={`${steps.join(' and ')} limits`} />;
}
