// A synthetic back-EMF spin whose characteristics are known in closed form, for checks of the
// derived values. Convention (resolver-offset.ts): θ = 0 where the U-phase line-to-neutral
// back-EMF crosses zero going positive, so u_uv ∝ sin(θ + 30°); vw and wu follow 120° and 240°
// later in a U-V-W machine.

export type SyntheticSpin = {
  sampleRateHz: number; speedRpm: number; polePairs: number; samples: number;
  /** Peak amplitude of each harmonic order of every line, in volts; order 1 is the fundamental. */
  harmonicsPeakV: Record<number, number>;
  /** Multiplies one line's amplitude (a weak magnet), 1 elsewhere. */
  lineScale?: { uv?: number; vw?: number; wu?: number };
  /** U-W-V instead of U-V-W: two leads exchanged. */
  reversed?: boolean;
  resolverOffsetDeg?: number;
  thetaAtStartDeg?: number;
};

export function syntheticSpin(spin: SyntheticSpin) {
  const electricalHz = (spin.polePairs * spin.speedRpm) / 60;
  const lineShiftDeg = { uv: 30, vw: spin.reversed ? 150 : -90, wu: spin.reversed ? -90 : 150 };
  const theta0 = ((spin.thetaAtStartDeg ?? 17) * Math.PI) / 180;
  const thetaAt = (n: number) => theta0 + (2 * Math.PI * electricalHz * n) / spin.sampleRateHz;
  const line = (name: 'uv' | 'vw' | 'wu') => Array.from({ length: spin.samples }, (_, n) => {
    let v = 0;
    for (const [order, peakV] of Object.entries(spin.harmonicsPeakV)) {
      const h = Number(order);
      v += peakV * Math.sin(h * (thetaAt(n) + (lineShiftDeg[name] * Math.PI) / 180));
    }
    return v * (spin.lineScale?.[name] ?? 1);
  });
  const offsetDeg = spin.resolverOffsetDeg ?? 0;
  const resolverAngleDeg = Array.from({ length: spin.samples }, (_, n) => {
    const deg = (thetaAt(n) * 180) / Math.PI + offsetDeg;
    return ((deg % 360) + 360) % 360;
  });
  return {
    kind: 'back-emf' as const, sampleRateHz: spin.sampleRateHz, speedRpm: spin.speedRpm,
    lineToLineV: { uv: line('uv'), vw: line('vw'), wu: line('wu') },
    resolverAngleDeg,
  };
}

/** The stored canonical bytes, built independently of the server: float64 LE, uv, vw, wu, resolver. */
export function canonicalBytes(channels: number[][]): Buffer {
  const bytes = Buffer.alloc(channels.length * channels[0].length * 8);
  channels.flat().forEach((value, i) => bytes.writeDoubleLE(value, i * 8));
  return bytes;
}
