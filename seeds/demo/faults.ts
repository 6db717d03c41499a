/**
 * What can be wrong with a motor at the EOL stand, and whether rework cures it. A fault shifts
 * the characteristics it affects (see values/); the rest of the run is measured as usual.
 */
export type FaultKind =
  | 'crimp' // a poor phase-lead crimp: one phase resistance high → resistance unbalance
  | 'contamination' // debris in the slot liners: hipot leakage high
  | 'moisture' // damp winding: insulation resistance and DAR low
  | 'resolver' // resolver stator mounted at the wrong angle: resolver offset out
  | 'bearing' // damaged bearing: noise and vibration high
  | 'brush' // brushes not bedded in: no-load current high (DC)
  | 'swapped-sequence' // two phase leads exchanged at the terminal box
  | 'damaged-magnet'; // a chipped magnet: one back-EMF line voltage low → unbalance

/**
 * The everyday faults of each product, drawn for the few percent of motors that fail; rework cures
 * them. A damaged magnet is not cured at the EOL cell (it needs a new rotor), so it is scripted.
 */
export const everydayFaults: Record<'PM-150' | 'IM-4P' | 'DC-24A', readonly FaultKind[]> = {
  'PM-150': ['crimp', 'contamination', 'moisture', 'resolver', 'resolver', 'bearing'],
  'IM-4P': ['crimp', 'contamination', 'moisture', 'bearing', 'bearing'],
  'DC-24A': ['contamination', 'moisture', 'brush', 'brush'],
};
