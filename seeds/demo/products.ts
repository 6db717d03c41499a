import type { ProductCreateInput } from '../../server/schemas/setup.js';

/** One characteristic as the demo plant defines it; sort order follows the test sequence. */
export type DemoCharacteristic = {
  code: string; name: string; unit: string; testStep: string;
  spc?: { mode: 'individual' | 'lot' } | { mode: 'consecutive'; size: number };
  /** Fluxtrail will compute it from raw readings or waveforms; the demo stands post the value. */
  derived?: boolean;
};

export type DemoProduct = ProductCreateInput & { characteristics: DemoCharacteristic[] };

const windingResistance = (unit: string): DemoCharacteristic[] => [
  { code: 'winding_temp', name: 'Winding temperature at resistance test', unit: '°C', testStep: 'winding-resistance' },
  ...(['u', 'v', 'w'] as const).map((phase) => ({
    code: `r_${phase}_20c`, name: `Phase resistance ${phase.toUpperCase()} at 20 °C`, unit, testStep: 'winding-resistance', derived: true,
  })),
  { code: 'r_unbalance', name: 'Phase resistance unbalance (NEMA MG 1)', unit: '%', testStep: 'winding-resistance', derived: true, spc: { mode: 'individual' } },
];

const insulation = (irVoltage: string): DemoCharacteristic =>
  ({ code: 'ir_40c', name: `Insulation resistance at 40 °C (1 min, ${irVoltage} DC)`, unit: 'MΩ', testStep: 'insulation', derived: true });

// Hipot results are records only: Fluxtrail does not drive the test equipment.
const hipot: DemoCharacteristic[] = [
  { code: 'hipot_voltage', name: 'Hipot test voltage applied (AC RMS, 1 s)', unit: 'V', testStep: 'hipot' },
  { code: 'hipot_leakage', name: 'Hipot leakage current', unit: 'mA', testStep: 'hipot', spc: { mode: 'individual' } },
];

/** A permanent-magnet traction motor: the main case, with back-EMF and resolver tests. */
const tractionMotor: DemoProduct = {
  code: 'PM-150', name: 'PM-150 traction motor, 150 kW hairpin stator', motorKind: 'pmsm',
  // Resolver with as many pole pairs as the motor: resolver and motor electrical angles coincide.
  polePairs: 4, resolverPolePairs: 4, ratedVoltageV: 350, ratedPowerKw: 150, ratedSpeedRpm: 12000,
  windingMaterial: 'copper', windingType: 'random', insulationClass: 'H', serialPattern: '^PM150-[0-9]{6}$',
  reason: 'Demo plant: traction motor introduced on lines A and B',
  characteristics: [
    ...windingResistance('mΩ'),
    insulation('1000 V'),
    { code: 'dar', name: 'Dielectric absorption ratio (60 s / 30 s)', unit: '1', testStep: 'insulation', derived: true },
    ...hipot,
    { code: 'ke', name: 'Back-EMF constant Ke (line-to-line RMS)', unit: 'V/krpm', testStep: 'back-emf', derived: true, spc: { mode: 'lot' } },
    { code: 'emf_frequency', name: 'Back-EMF electrical frequency at 1000 rpm', unit: 'Hz', testStep: 'back-emf', derived: true },
    { code: 'emf_thd', name: 'Back-EMF THD, worst phase', unit: '%', testStep: 'back-emf', derived: true, spc: { mode: 'individual' } },
    { code: 'emf_unbalance', name: 'Back-EMF unbalance (NEMA MG 1)', unit: '%', testStep: 'back-emf', derived: true },
    { code: 'phase_sequence', name: 'Phase sequence (+1 = U-V-W, −1 = reversed)', unit: '1', testStep: 'back-emf', derived: true },
    { code: 'phase_spacing_dev', name: 'Phase spacing deviation from 120°, worst pair', unit: 'deg el', testStep: 'back-emf', derived: true },
    { code: 'resolver_offset', name: 'Resolver offset', unit: 'deg el', testStep: 'resolver', derived: true, spc: { mode: 'individual' } },
    { code: 'ld', name: 'Inductance Ld at 1 kHz', unit: 'µH', testStep: 'inductance' },
    { code: 'lq', name: 'Inductance Lq at 1 kHz', unit: 'µH', testStep: 'inductance' },
    { code: 'no_load_current', name: 'No-load current at 3000 rpm', unit: 'A', testStep: 'no-load' },
    { code: 'noise', name: 'Noise level at 1 m, 6000 rpm', unit: 'dB(A)', testStep: 'noise-vibration', spc: { mode: 'consecutive', size: 5 } },
    { code: 'vibration', name: 'Vibration velocity at 6000 rpm', unit: 'mm/s', testStep: 'noise-vibration' },
  ],
};

/** A four-pole induction pump motor: copper stator, aluminium cage. */
const pumpMotor: DemoProduct = {
  code: 'IM-4P', name: 'IM-4P pump motor, 7.5 kW four-pole', motorKind: 'induction',
  polePairs: 2, resolverPolePairs: null, ratedVoltageV: 400, ratedPowerKw: 7.5, ratedSpeedRpm: 1450,
  windingMaterial: 'copper', windingType: 'random', insulationClass: 'F', serialPattern: '^IM4P-[0-9]{6}$',
  reason: 'Demo plant: pump motor on line B',
  characteristics: [
    ...windingResistance('Ω'),
    insulation('500 V'),
    ...hipot,
    { code: 'no_load_current', name: 'No-load current at 400 V, 50 Hz', unit: 'A', testStep: 'no-load', spc: { mode: 'individual' } },
    { code: 'rated_speed', name: 'Speed at rated load', unit: 'rpm', testStep: 'load' },
    { code: 'slip', name: 'Slip at rated load', unit: '%', testStep: 'load', derived: true, spc: { mode: 'individual' } },
    { code: 'vibration', name: 'Vibration velocity at no load', unit: 'mm/s', testStep: 'noise-vibration' },
    { code: 'noise', name: 'Noise level at 1 m, no load', unit: 'dB(A)', testStep: 'noise-vibration' },
  ],
};

/** A small permanent-magnet brushed DC actuator motor. */
const actuatorMotor: DemoProduct = {
  code: 'DC-24A', name: 'DC-24A brushed actuator motor, 24 V 0.2 kW', motorKind: 'dc',
  polePairs: 1, resolverPolePairs: null, ratedVoltageV: 24, ratedPowerKw: 0.2, ratedSpeedRpm: 3000,
  windingMaterial: 'copper', windingType: 'random', insulationClass: 'B', serialPattern: '^DC24A-[0-9]{6}$',
  reason: 'Demo plant: actuator motor on line A',
  characteristics: [
    { code: 'winding_temp', name: 'Armature temperature at resistance test', unit: '°C', testStep: 'winding-resistance' },
    { code: 'armature_r_20c', name: 'Armature resistance at 20 °C', unit: 'Ω', testStep: 'winding-resistance', derived: true },
    insulation('500 V'),
    ...hipot,
    { code: 'ke', name: 'Back-EMF constant Ke', unit: 'V/krpm', testStep: 'back-emf', derived: true, spc: { mode: 'lot' } },
    { code: 'no_load_speed', name: 'No-load speed at 24 V', unit: 'rpm', testStep: 'no-load', spc: { mode: 'individual' } },
    { code: 'no_load_current', name: 'No-load current at 24 V', unit: 'A', testStep: 'no-load' },
  ],
};

export const demoProducts: readonly DemoProduct[] = [tractionMotor, pumpMotor, actuatorMotor];
export type DemoProductCode = 'PM-150' | 'IM-4P' | 'DC-24A';
