// The wording behind every number on the board, shown on hover so that a figure is never read
// without knowing what was counted.
export const definitions = {
  firstPassYield: 'First-pass yield = motors passing their first test without retest or rework ÷ motors tested',
  finalYield: 'Final yield = motors whose latest test passed, after any retest or rework ÷ motors tested',
  tested: 'Motors tested = motors whose first test started in the period; a retest does not count a motor again',
  onHold: 'Motors on hold = motors that may not ship now because of a hold on the motor or its lot',
  openSignals: 'Open signals = SPC alarms that nobody has acknowledged yet',
  pareto: 'Failing characteristics = failing measurements on first attempts, most frequent first; share = its part of all such failures',
  target: 'Target = the first-pass yield the plant aims for, set with the shift calendar in Setup',
} as const;
