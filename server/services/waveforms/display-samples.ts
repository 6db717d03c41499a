/**
 * Down-sampling for display only: a screen of a few thousand pixels cannot show 100k samples,
 * and sending them all would cost megabytes per chart. Each bucket keeps its lowest and highest
 * sample in the order they occur, so peaks and glitches survive (a plain stride would drop
 * them). Never used for any computed value: those come from the full record.
 */
export const MAX_DISPLAY_POINTS = 4000;

/** [time in ms, value] pairs, at most maxPoints of them. */
export function minMaxEnvelope(samples: Float64Array, sampleRateHz: number, maxPoints = MAX_DISPLAY_POINTS): Array<[number, number]> {
  const msPerSample = 1000 / sampleRateHz;
  const point = (i: number): [number, number] => [round(i * msPerSample, 4), round(samples[i], 4)];
  if (samples.length <= maxPoints) return Array.from(samples, (_, i) => point(i));
  const buckets = Math.floor(maxPoints / 2);
  const points: Array<[number, number]> = [];
  for (let b = 0; b < buckets; b++) {
    const start = Math.floor((b * samples.length) / buckets);
    const end = Math.floor(((b + 1) * samples.length) / buckets);
    let low = start;
    let high = start;
    for (let i = start + 1; i < end; i++) {
      if (samples[i] < samples[low]) low = i;
      if (samples[i] > samples[high]) high = i;
    }
    const [first, second] = low <= high ? [low, high] : [high, low];
    points.push(point(first));
    if (second !== first) points.push(point(second));
  }
  return points;
}

// Four decimals of a millisecond or a volt is beyond what a chart can show and halves the JSON.
function round(value: number, decimals: number): number {
  const factor = 10 ** decimals;
  return Math.round(value * factor) / factor;
}
