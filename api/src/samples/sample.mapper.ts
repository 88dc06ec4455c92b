import type { SampleDetail, SampleSummary } from '@keyloom/shared';
import type { SampleFlag } from './sample-flag.entity';
import type { Sample } from './sample.entity';

// Entity → API shapes of samples.schema.ts. People appear by name (the uploader or decider).

/** `uploadedByName`: the uploader's name; '(removed account)' when the account is gone. */
export function toSampleSummary(
  sample: Sample,
  openFlags: number,
  uploadedByName?: string | null,
): SampleSummary {
  return {
    id: sample.id,
    clientId: sample.clientId,
    title: sample.title,
    fileName: sample.fileName,
    sourceKind: sample.sourceKind,
    periodStart: sample.periodStart,
    periodEnd: sample.periodEnd,
    note: sample.note,
    status: sample.status,
    excludedReason: sample.excludedReason,
    encoding: sample.encoding,
    sha256: sample.sha256,
    byteSize: sample.byteSize,
    characters: sample.characters,
    words: sample.words,
    distinctWords: sample.distinctWords,
    openFlags,
    uploadedBy: uploadedByName ?? sample.uploadedBy?.name ?? '(removed account)',
    createdAt: sample.createdAt.toISOString(),
  };
}

export function toSampleDetail(sample: Sample, flags: SampleFlag[]): SampleDetail {
  const openFlags = flags.filter((f) => f.status === 'open').length;
  return {
    ...toSampleSummary(sample, openFlags),
    text: sample.text,
    topWords: sample.topWords,
    unknownWords: sample.unknownWords,
    flags: flags.map((f) => ({
      id: f.id,
      kind: f.kind,
      start: f.start,
      end: f.end,
      text: f.text,
      status: f.status,
      reason: f.reason,
      decidedBy: f.decidedBy ? f.decidedBy.name : null,
      decidedAt: f.decidedAt ? f.decidedAt.toISOString() : null,
    })),
  };
}
