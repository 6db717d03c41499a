import type { DemoProductCode } from './products.js';

export type ComponentKind = 'stator' | 'magnet' | 'rotor' | 'resolver';
export type DemoComponent = { kind: ComponentKind; supplierLotCode: string; supplier: string };

/**
 * One production lot: its line and the time window (days before today) its motors reached the
 * EOL stands. `fixedMotors` pins the lot's size whatever the demo size (the story lots).
 */
export type DemoLot = {
  code: string; productCode: DemoProductCode; line: 'A' | 'B';
  startDaysAgo: number; endDaysAgo: number;
  components: DemoComponent[];
  fixedMotors?: number;
};

// Invented suppliers.
const suppliers: Record<ComponentKind, string> = {
  stator: 'Talmont Laminations', magnet: 'Ferrowen Magnetics', rotor: 'Quillby Castings', resolver: 'Renvale Sensors',
};
const part = (kind: ComponentKind, supplierLotCode: string): DemoComponent => ({ kind, supplierLotCode, supplier: suppliers[kind] });

const pm = (n: number, line: 'A' | 'B', startDaysAgo: number, endDaysAgo: number, magnetLot: string, fixedMotors?: number): DemoLot => ({
  code: `L2611-${String(n).padStart(2, '0')}`, productCode: 'PM-150', line, startDaysAgo, endDaysAgo, fixedMotors,
  components: [part('stator', `STA-${5200 + n * 7}`), part('magnet', magnetLot), part('rotor', `ROT-${3300 + n * 5}`), part('resolver', `RSV-${880 + n}`)],
});
const im = (n: number, startDaysAgo: number, endDaysAgo: number): DemoLot => ({
  code: `L2621-${String(n).padStart(2, '0')}`, productCode: 'IM-4P', line: 'B', startDaysAgo, endDaysAgo,
  components: [part('stator', `STA-${6100 + n * 9}`), part('rotor', `ROT-${4400 + n * 3}`)],
});
const dc = (n: number, startDaysAgo: number, endDaysAgo: number, magnetLot: string): DemoLot => ({
  code: `L2631-${String(n).padStart(2, '0')}`, productCode: 'DC-24A', line: 'A', startDaysAgo, endDaysAgo,
  components: [part('rotor', `ARM-${2700 + n * 11}`), part('magnet', magnetLot)],
});

/** The drifting lot: back-EMF constant creeping up towards the USL over its last days. */
export const driftingLot = pm(12, 'A', 4.5, 1.25, 'MAG-7790', 120);

// Line A makes PM-150 and DC-24A, line B PM-150 and IM-4P; lots follow one another on each line.
// Magnet lots MAG-7731 and MAG-7744 feed several lots, so a where-used search finds them all.
export const demoLots: readonly DemoLot[] = [
  pm(1, 'A', 30, 27.5, 'MAG-7731'),
  im(1, 30, 27),
  dc(1, 27.5, 26, 'MAG-7731'),
  pm(2, 'B', 27, 24, 'MAG-7731'),
  pm(3, 'A', 26, 23, 'MAG-7731'),
  im(2, 24, 21),
  pm(4, 'A', 23, 20.5, 'MAG-7744'),
  pm(5, 'B', 21, 18, 'MAG-7744'),
  dc(2, 20.5, 19, 'MAG-7744'),
  pm(6, 'A', 19, 16, 'MAG-7744'),
  im(3, 18, 15),
  pm(7, 'A', 16, 13, 'MAG-7752'),
  pm(8, 'B', 15, 12, 'MAG-7752'),
  dc(3, 13, 11.5, 'MAG-7761'),
  im(4, 12, 9),
  pm(9, 'A', 11.5, 8, 'MAG-7768'),
  pm(10, 'B', 9, 6, 'MAG-7768'),
  pm(11, 'A', 8, 4.5, 'MAG-7790'),
  im(5, 6, 3.5),
  driftingLot,
  pm(13, 'B', 3.5, 0.25, 'MAG-7790'),
];

/** Lot numbers in serials: PM150-120001 is the first motor of lot L2611-12. */
export function lotNumberOf(lot: DemoLot): number {
  return Number(lot.code.slice(-2));
}
