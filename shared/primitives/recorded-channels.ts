/**
 * A recording's channels against one body: which of them the body can follow (a suit may lock a
 * dof, e.g. waist flexion), and how close each kept channel comes to its joint's range limits over
 * the trimmed frames. Used when a recording becomes a composer step and to plot it there.
 */
import { type RecordedSweep,trimmedFrameRange } from './primitive-schemas.ts';

/** A joint's allowed range, degrees. */
export interface ChannelRange {
  min: number;
  max: number;
}

/** The channels a body has, and the ones left out because it has no such dof. */
export interface FittedChannels {
  dofs: string[];
  /** Frames with only the kept channels, in the order of `dofs`. */
  frames: number[][];
  /** Channels left out, in the recording's order. */
  dropped: string[];
}

/** Keeps only the channels `has` accepts (frames cut to match); the rest are listed as dropped. */
export function fitChannelsToBody(recording: { dofs: readonly string[]; frames: readonly (readonly number[])[] }, has: (dof: string) => boolean): FittedChannels {
  const keep = recording.dofs.map((d, k) => (has(d) ? k : -1)).filter((k) => k >= 0);
  return {
    dofs: keep.map((k) => recording.dofs[k]),
    frames: recording.frames.map((f) => keep.map((k) => f[k])),
    dropped: recording.dofs.filter((d) => !has(d)),
  };
}

/** How one channel of a trimmed recorded sweep sits in its range. */
export interface ChannelMargin {
  dof: string;
  /** Lowest and highest frame value, degrees. */
  lowDeg: number;
  highDeg: number;
  /** The joint's range (null: the body has no such dof). */
  range: ChannelRange | null;
  /**
   * Smallest distance inside the range over the frames, degrees: min(low − min, max − high);
   * negative when a frame is beyond a limit (by that much). Null without a range.
   */
  marginDeg: number | null;
  /** Which limit is closest. */
  nearest: 'min' | 'max' | null;
}

/** Margins of every channel of a recorded sweep's trimmed frames against `ranges` (dof → range). */
export function channelMargins(p: Pick<RecordedSweep, 'dofs' | 'frames' | 'rateHz' | 'trimStartS' | 'trimEndS'>, ranges: Readonly<Record<string, ChannelRange>>): ChannelMargin[] {
  const { first, count } = trimmedFrameRange(p);
  const rows = p.frames.slice(first, first + count);
  return p.dofs.map((dof, k) => {
    let lowDeg = Infinity, highDeg = -Infinity;
    for (const f of rows) {
      lowDeg = Math.min(lowDeg, f[k]);
      highDeg = Math.max(highDeg, f[k]);
    }
    const range = ranges[dof] ?? null;
    if (!range || !rows.length) return { dof, lowDeg, highDeg, range, marginDeg: null, nearest: null };
    const below = lowDeg - range.min, above = range.max - highDeg;
    return { dof, lowDeg, highDeg, range, marginDeg: Math.min(below, above), nearest: below <= above ? 'min' : 'max' };
  });
}
