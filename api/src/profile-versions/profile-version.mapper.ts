import type { ProfileVersion as ProfileVersionShape } from '@keyloom/shared';
import type { ProfileVersion } from './profile-version.entity';
import { INTERRUPTED_STAGE } from './training-recovery';

/**
 * The API shape: profileVersionSchema of shared/src/schemas/profile-versions.schema.ts (who signed
 * off and approved, the send-back reason, the base model's weight and hash included). The frozen
 * sample texts are never sent.
 */
export type ProfileVersionDto = ProfileVersionShape;

const REMOVED = '(removed account)';

/**
 * A running stage whose heartbeat is older than `staleMs` belongs to a dead worker: it is shown as
 * "interrupted" at 0 % (a worker queues it again from the start) rather than a frozen percentage.
 */
function liveProgress(v: ProfileVersion, staleMs: number): { stage: string | null; progress: number } {
  const running =
    v.status === 'training' && v.stage !== null && v.stage !== 'queued' && v.stage !== INTERRUPTED_STAGE;
  const beat = v.heartbeatAt?.getTime() ?? 0;
  return running && Date.now() - beat > staleMs
    ? { stage: INTERRUPTED_STAGE, progress: 0 }
    : { stage: v.stage, progress: v.progress };
}

/** Entity (with createdBy, signedOffBy, approvedBy, retiredBy loaded) → API shape; `staleMs`: TRAINING_STALE_SECONDS. */
export function toProfileVersionDto(v: ProfileVersion, staleMs: number): ProfileVersionDto {
  return {
    id: v.id,
    clientId: v.clientId,
    number: v.number,
    note: v.note,
    status: v.status,
    ...liveProgress(v, staleMs),
    error: v.error,
    settings: v.settings,
    samples: v.samples.map(({ id, title, sha256, characters }) => ({ id, title, sha256, characters })),
    baseOnly: v.baseOnly,
    metrics: v.metrics,
    modelBytes: v.modelSize,
    createdBy: v.createdBy?.name ?? REMOVED,
    createdAt: v.createdAt.toISOString(),
    trainedAt: v.trainedAt?.toISOString() ?? null,
    history: v.history,
    baseWeight: v.baseWeight,
    baseModelSha256: v.baseModelSha256,
    signedOffBy: v.signedOffById ? (v.signedOffBy?.name ?? REMOVED) : null,
    signedOffAt: v.signedOffAt?.toISOString() ?? null,
    signOffComment: v.signOffComment,
    approvedBy: v.approvedById ? (v.approvedBy?.name ?? REMOVED) : null,
    approvedAt: v.approvedAt?.toISOString() ?? null,
    approvalComment: v.approvalComment,
    sentBackReason: v.sentBackReason,
    retiredBy: v.retiredById ? (v.retiredBy?.name ?? REMOVED) : null,
    retiredAt: v.retiredAt?.toISOString() ?? null,
    retireReason: v.retireReason,
  };
}
