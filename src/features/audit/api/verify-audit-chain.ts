import { useMutation } from '@tanstack/react-query';
import { useState } from 'react';
import { z } from 'zod';
import { ApiError } from '../../../lib/api-client';

const lineSchema = z.discriminatedUnion('type', [
  z.object({ type: z.literal('progress'), checked: z.number(), total: z.number() }),
  z.object({ type: z.literal('result'), ok: z.boolean(), checked: z.number(), firstBrokenId: z.number().optional(), problem: z.string().optional() }),
  z.object({ type: z.literal('error'), message: z.string() }),
]);
export type ChainResult = { ok: boolean; checked: number; firstBrokenId?: number; problem?: string };
export type ChainProgress = { checked: number; total: number };

/**
 * Walks the chain through the streaming variant of the verify endpoint: one JSON line per page
 * checked, then the verdict. Read as a stream so the progress bar moves while the server works.
 */
export async function verifyAuditChain(onProgress: (p: ChainProgress) => void): Promise<ChainResult> {
  const response = await fetch('/api/v1/audit/verify?stream=1', { credentials: 'same-origin', headers: { accept: 'application/x-ndjson' } });
  if (!response.ok || !response.body) throw new ApiError(response.status, `http_${response.status}`, 'The audit chain could not be verified.');
  const reader = response.body.pipeThrough(new TextDecoderStream()).getReader();
  let buffered = '';
  for (;;) {
    const { value, done } = await reader.read();
    buffered += value ?? '';
    const lines = buffered.split('\n');
    buffered = lines.pop() ?? '';
    for (const text of lines.filter(Boolean)) {
      const line = lineSchema.parse(JSON.parse(text));
      if (line.type === 'progress') onProgress(line);
      else if (line.type === 'error') throw new ApiError(500, 'verify_failed', line.message);
      else return { ok: line.ok, checked: line.checked, firstBrokenId: line.firstBrokenId, problem: line.problem };
    }
    if (done) throw new ApiError(0, 'verify_incomplete', 'The server stopped before giving a verdict; try again.');
  }
}

export function useVerifyAuditChain() {
  const [progress, setProgress] = useState<ChainProgress | null>(null);
  const mutation = useMutation({
    mutationFn: () => {
      setProgress(null);
      return verifyAuditChain(setProgress);
    },
  });
  return { ...mutation, progress };
}
