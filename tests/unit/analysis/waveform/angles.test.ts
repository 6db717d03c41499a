import { describe, expect, it } from 'vitest';
import { wrapDegrees180, wrapDegrees360 } from '../../../../server/analysis/waveform/index.js';

// Reference: Math.atan2(sin x, cos x) (ECMAScript standard library) gives the angle in (−π, π].
const viaAtan2 = (deg: number) => (Math.atan2(Math.sin((deg * Math.PI) / 180), Math.cos((deg * Math.PI) / 180)) * 180) / Math.PI;

describe('wrapDegrees180 and wrapDegrees360', () => {
  it('when angles span several turns, then both agree with atan2 of sine and cosine', () => {
    for (let deg = -1085.3; deg < 1100; deg += 17.7) {
      expect(wrapDegrees180(deg)).toBeCloseTo(viaAtan2(deg), 9);
      expect(wrapDegrees360(deg)).toBeCloseTo(((viaAtan2(deg) % 360) + 360) % 360, 9);
    }
  });

  it('when an angle sits on a range edge, then it lands on the included end', () => {
    expect(wrapDegrees180(180)).toBe(180);
    expect(wrapDegrees180(-180)).toBe(180);
    expect(wrapDegrees180(540)).toBe(180);
    expect(wrapDegrees360(360)).toBe(0);
    expect(wrapDegrees360(-1e-15)).toBeLessThan(360);
  });

  it('when the angle is not finite, then it throws naming angleDeg', () => {
    expect(() => wrapDegrees180(Number.NaN)).toThrow(/angleDeg/);
    expect(() => wrapDegrees360(Infinity)).toThrow(/angleDeg/);
  });
});
