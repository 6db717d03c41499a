import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { setupStationsQueryOptions } from './get-stations';
import { calibrationSchema, setupApiBase } from './setup-schemas';

const responseSchema = z.object({ calibrations: z.array(calibrationSchema) }).transform((body) => body.calibrations);

/** Under the stations key, so recording a calibration refreshes both the list and the history. */
export const calibrationsQueryOptions = (stationCode: string) =>
  queryOptions({
    queryKey: [...setupStationsQueryOptions().queryKey, stationCode, 'calibrations'] as const,
    queryFn: ({ signal }) => apiClient.get(`${setupApiBase}/stations/${encodeURIComponent(stationCode)}/calibrations`, { schema: responseSchema, signal }),
  });

export function useCalibrations(stationCode: string) {
  return useQuery(calibrationsQueryOptions(stationCode));
}
