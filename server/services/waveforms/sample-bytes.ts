/**
 * The canonical bytes of a waveform's raw samples, which the blob store hashes and keeps:
 * IEEE 754 float64, little-endian, channel after channel (uv, vw, wu, then the resolver angle
 * when it was sampled), each channel samplesPerChannel long. No header: the waveforms row holds
 * the kind, sample rate and samples per channel, so the channel count is bytes / (8 × that).
 * Float64 because the JSON numbers a stand posts are doubles, so nothing posted is rounded.
 */
export const BACK_EMF_CHANNELS = ['uv', 'vw', 'wu', 'resolverAngleDeg'] as const;
export type BackEmfChannel = (typeof BACK_EMF_CHANNELS)[number];

const BYTES_PER_SAMPLE = 8;

export function encodeChannels(channels: ReadonlyArray<ArrayLike<number>>): Buffer {
  const samplesPerChannel = channels[0]?.length ?? 0;
  const bytes = Buffer.allocUnsafe(channels.length * samplesPerChannel * BYTES_PER_SAMPLE);
  let offset = 0;
  for (const channel of channels) {
    if (channel.length !== samplesPerChannel) throw new Error('every channel must hold the same number of samples');
    for (let i = 0; i < channel.length; i++, offset += BYTES_PER_SAMPLE) bytes.writeDoubleLE(channel[i], offset);
  }
  return bytes;
}

export function decodeChannels(bytes: Buffer, samplesPerChannel: number): Float64Array[] {
  const channelBytes = samplesPerChannel * BYTES_PER_SAMPLE;
  if (samplesPerChannel <= 0 || bytes.length % channelBytes !== 0) {
    throw new Error(`A blob of ${bytes.length} bytes does not hold whole channels of ${samplesPerChannel} samples.`);
  }
  const channels: Float64Array[] = [];
  for (let start = 0; start < bytes.length; start += channelBytes) {
    const channel = new Float64Array(samplesPerChannel);
    for (let i = 0; i < samplesPerChannel; i++) channel[i] = bytes.readDoubleLE(start + i * BYTES_PER_SAMPLE);
    channels.push(channel);
  }
  return channels;
}
