import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { CalibrationInput } from '../../../../server/schemas/setup';
import { apiClient } from '../../../lib/api-client';
import { setupStationsQueryOptions } from './get-stations';
import { calibrationSchema, setupApiBase, stationSchema } from './setup-schemas';

const responseSchema = z.object({ station: stationSchema, calibration: calibrationSchema });

export function recordCalibration(stationCode: string, input: CalibrationInput) {
  return apiClient.post(`${setupApiBase}/stations/${encodeURIComponent(stationCode)}/calibrations`, { schema: responseSchema, body: input });
}

export function useRecordCalibration(stationCode: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CalibrationInput) => recordCalibration(stationCode, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: setupStationsQueryOptions().queryKey }),
  });
}
