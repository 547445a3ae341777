/** A recordings row (and its upload's file name) as the API returns it. */
import type { RecordingRow } from '../../db/schema/index.ts';
import type { BvhJointInfo, RecordingView } from '../../shared/contracts/recording.ts';

/** The API view of a stored recording; `bvhJoints` come from re-reading the file (BVH only). */
export function recordingView(row: RecordingRow, fileName: string, bvhJoints: BvhJointInfo[] | null = null): RecordingView {
  const frames = row.frames;
  return {
    id: row.id, name: row.name, source: row.source, uploadId: row.uploadId, fileName,
    crewMemberId: row.crewMemberId, rateHz: row.rateHz, duration: (frames.length - 1) / row.rateHz,
    dofs: row.dofs, frames, assumptions: row.assumptions,
    mapping: row.mapping ?? null, bvhJoints, createdAt: row.createdAt.toISOString(),
  };
}
