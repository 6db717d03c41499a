import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';

const point = z.tuple([z.number(), z.number()]);

/** One waveform for display: samples down-sampled (min/max per bucket) and the harmonic spectrum. */
export const waveformDisplaySchema = z.object({
  kind: z.string(),
  sampleRateHz: z.number(),
  speedRpm: z.number(),
  samplesPerChannel: z.number(),
  downsampled: z.boolean(),
  lineToLineV: z.object({ uv: z.array(point), vw: z.array(point), wu: z.array(point) }),
  spectrum: z.array(z.object({ order: z.number(), uv: z.number(), vw: z.number(), wu: z.number() })),
});
export type WaveformDisplay = z.infer<typeof waveformDisplaySchema>;

type WaveformKey = { serial: string; runId: string; kind: string };

export function getWaveform({ serial, runId, kind }: WaveformKey, signal?: AbortSignal): Promise<WaveformDisplay> {
  const path = `/api/v1/motors/${encodeURIComponent(serial)}/runs/${encodeURIComponent(runId)}/waveforms/${encodeURIComponent(kind)}`;
  return apiClient.get(path, { schema: waveformDisplaySchema, signal });
}

export const waveformQueryOptions = (key: WaveformKey) =>
  queryOptions({
    queryKey: ['motors', 'waveform', key.serial, key.runId, key.kind] as const,
    queryFn: ({ signal }) => getWaveform(key, signal),
    // A stored waveform never changes: keep it for the session.
    staleTime: Infinity,
  });

export function useWaveform(key: WaveformKey) {
  return useQuery(waveformQueryOptions(key));
}
