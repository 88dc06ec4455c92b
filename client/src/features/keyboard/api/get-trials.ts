import { type Trial, trialSchema } from '@keyloom/shared';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';
import { trialKeys } from './keys';

const trialListSchema = z.array(trialSchema);

/** The trials of one profile version, newest first as the API sends them (no event logs). */
export const getTrials = (versionId: string, signal?: AbortSignal): Promise<Trial[]> =>
  apiRequest(`/profile-versions/${encodeURIComponent(versionId)}/trials`, {
    schema: trialListSchema,
    signal,
  });

export const trialsQueryOptions = (versionId: string) =>
  queryOptions({
    queryKey: trialKeys.list(versionId),
    queryFn: ({ signal }) => getTrials(versionId, signal),
  });

/** @param versionId the version, or null while none is chosen (nothing is asked then) */
export const useTrials = (versionId: string | null) =>
  useQuery({ ...trialsQueryOptions(versionId ?? ''), enabled: versionId !== null && versionId !== '' });
