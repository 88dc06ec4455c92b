import type {
  ApproveInput,
  ProfileVersion,
  ReportProblemInput,
  RetireInput,
  SendBackInput,
  SignOffInput,
} from '@keyloom/shared';
import { profileVersionSchema } from '@keyloom/shared';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { profileVersionKeys } from './keys';

/**
 * The decisions on a trained version, each a POST to /api/profile-versions/:id/<decision>:
 * the assigned carer signs off or reports a problem after a trial (trained → signed_off / sent_back),
 * a supervisor approves or sends back (signed_off → active / sent_back), and retires the active
 * version (active → retired; the previous approved one becomes active again).
 */
export type DecisionInputs = {
  'sign-off': SignOffInput;
  'report-problem': ReportProblemInput;
  approve: ApproveInput;
  'send-back': SendBackInput;
  retire: RetireInput;
};
export type Decision = keyof DecisionInputs;

export type DecisionVariables<D extends Decision> = { versionId: string; input: DecisionInputs[D] };

/** Sends one decision; the API answers with the version in its new state. */
export const decideProfileVersion = <D extends Decision>(
  decision: D,
  { versionId, input }: DecisionVariables<D>,
): Promise<ProfileVersion> =>
  apiRequest(`/profile-versions/${encodeURIComponent(versionId)}/${decision}`, {
    method: 'POST',
    body: input,
    schema: profileVersionSchema,
  });

export const useDecideProfileVersion = <D extends Decision>(decision: D) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (variables: DecisionVariables<D>) => decideProfileVersion(decision, variables),
    onSuccess: (version) => {
      queryClient.setQueryData(profileVersionKeys.detail(version.id), version);
      return queryClient.invalidateQueries({ queryKey: profileVersionKeys.all });
    },
  });
};
