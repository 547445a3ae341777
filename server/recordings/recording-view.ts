/** A recordings row (and its upload's file name) as the API returns it. */
import { z } from 'zod';

import type { RecordingRow } from '../../db/schema/index.ts';
import { readStored } from '../../db/stored-json.ts';
import { type BvhJointInfo, bvhMappingSchema, type RecordingView } from '../../shared/contracts/recording.ts';

const names = z.array(z.string());

/** The API view of a stored recording (its JSON parsed once here); `bvhJoints` come from re-reading the file (BVH only). */
export function recordingView(row: RecordingRow, fileName: string, bvhJoints: BvhJointInfo[] | null = null): RecordingView {
  const frames = readStored(z.array(z.array(z.number())), row.frames, 'recordings.frames');
  return {
    id: row.id, name: row.name, source: row.source, uploadId: row.uploadId, fileName,
    crewMemberId: row.crewMemberId, rateHz: row.rateHz, duration: (frames.length - 1) / row.rateHz,
    dofs: readStored(names, row.dofs, 'recordings.dofs'), frames, assumptions: readStored(names, row.assumptions, 'recordings.assumptions'),
    mapping: readStored(bvhMappingSchema.nullable(), row.mapping, 'recordings.mapping'), bvhJoints, createdAt: row.createdAt.toISOString(),
  };
}
