import { type CreateTrialInput, type Trial, trialSchema } from '@keyloom/shared';
import { apiRequest } from '@/lib/api-client';

/**
 * Uploads a finished trial. Idempotent by `input.localTrialId`: posting the same trial again
 * (after a lost answer) returns the stored one instead of making a second.
 * @throws ApiError — status 0 when the server could not be reached
 */
export const postTrial = (versionId: string, input: CreateTrialInput, signal?: AbortSignal): Promise<Trial> =>
  apiRequest(`/profile-versions/${encodeURIComponent(versionId)}/trials`, {
    method: 'POST',
    body: input,
    schema: trialSchema,
    signal,
  });
