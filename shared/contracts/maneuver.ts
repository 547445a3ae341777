/**
 * The maneuvers API contract: sequences, their versions, verification reports, reviews and
 * comparisons. Angles in degrees, times in seconds, timestamps ISO-8601 strings, ids UUIDs.
 *
 * Endpoints (all under /api, bearer token):
 * - GET    /sequences?crewMemberId=          → { sequences: SequenceSummary[] }
 * - POST   /sequences                        CreateSequenceRequest → 201 SequenceSummary   (planner, admin)
 * - GET    /sequences/:sequenceId            → SequenceDetail
 * - PATCH  /sequences/:sequenceId            UpdateSequenceRequest → SequenceSummary       (planner, admin)
 * - POST   /sequences/compile                CompileRequest → CompileResponse (no save, no simulation)
 * - POST   /sequences/:sequenceId/versions   SaveVersionRequest → 201 VersionDetail; 409 `stale_version`
 *          when `baseVersion` is not the latest version number; 400 naming `primitives[i]…` on bad steps.
 *          Compiles, binds the crew member's current profile version and verifies on the engine.
 * - GET    /sequences/versions/:versionId    → VersionDetail
 * - POST   /sequences/versions/:versionId/submit   SubmitRequest → VersionDetail             (author: planner, admin)
 * - GET    /sequences/versions/:versionId/compare/:otherVersionId → CompareResponse
 * - GET    /reviews/queue                    → { items: ReviewQueueItem[] }                   (reviewer, admin)
 * - POST   /reviews/:versionId/decision      ReviewDecisionRequest → VersionDetail             (reviewer, admin; never the author)
 * - POST   /reviews/:versionId/comments      ReviewCommentRequest → VersionDetail              (reviewer, admin)
 * Errors: `{ error: { code, message, field } }`; 409 codes: `stale_version`, `invalid_transition`.
 *
 * Statuses (shared/contracts/version-status.ts): drafting → under_review (submit) → cleared
 * (a reviewer who is not the author) or sent_back (with a comment). Saving a new version makes
 * older drafting / under_review / sent_back versions (and never-cleared recheck ones) `replaced`;
 * a cleared version stays cleared until a newer version of the same sequence is cleared, then it is
 * `replaced`. When the crew member's current profile version changes, cleared and under-review
 * versions bound to an older profile become `recheck` and are recomputed in the background
 * (`reverification`); a recheck version cannot be submitted: save a new version (same primitives)
 * which binds the new profile. Trainees see only cleared and recheck (once cleared) versions of
 * their own crew member.
 */
import { z } from 'zod';

import { primitiveListSchema } from '../primitives/primitive-schemas.ts';
import type { RecheckInfo } from '../product/recheck-status.ts';
import { CHECK_NAMES } from '../product/version-checks.ts';
import { jobRecordSchema } from './job-state.ts';
import { angleAxisSchema, attitudeSchema, finalStateSchema, rangeViolationSchema, yprSchema } from './result.ts';
import { robustnessBriefSchema, versionRobustnessSchema } from './robustness.ts';
import { sequenceSchema } from './sequence.ts';
import { versionStatusSchema } from './version-status.ts';

/** A failed check (shared/product/version-checks.ts). */
export const checkFailureSchema = z.object({
  check: z.enum(CHECK_NAMES),
  message: z.string(),
});

/**
 * Client routes the server links to in e-mails (the app must serve them):
 * - a reviewer's link to a submitted version: `<PUBLIC_URL>/reviews/<versionId>`;
 * - the author's link to a decided version: `<PUBLIC_URL>/maneuvers/<sequenceId>?version=<versionId>`.
 */
export const CLIENT_ROUTES = {
  review: (versionId: string) => `/reviews/${versionId}`,
  version: (sequenceId: string, versionId: string) => `/maneuvers/${sequenceId}?version=${versionId}`,
} as const;

const finite = (what: string) => z.number({ error: `${what} must be a finite number` });
const isoTime = z.string();

/** Yaw/pitch/roll, intrinsic z-y′-x″, degrees (body frame at t = 0: x anterior, y left, z head). */
export const yprDegSchema = z.object({
  /** Yaw about z, degrees, −180…180. */
  yaw: finite('yaw').min(-180).max(180),
  /** Pitch about y, degrees, −90…90. */
  pitch: finite('pitch').min(-90).max(90),
  /** Roll about x, degrees, −180…180. */
  roll: finite('roll').min(-180).max(180),
});

/** A rotation angle about an axis of the initial body frame. */
export const axisAngleSchema = z.object({
  /** Any non-zero vector (normalised when used). */
  axis: z.tuple([finite('axis'), finite('axis'), finite('axis')]).refine((a) => Math.hypot(...a) > 1e-9, 'axis must not be zero'),
  /** Right-handed angle, degrees, 0…180. */
  angleDeg: finite('angleDeg').min(0).max(180),
});

const targetLimits = {
  /** Largest acceptable final attitude error, degrees (default 2). */
  toleranceDeg: finite('toleranceDeg').positive().max(90).default(2),
  /** Joint rate limit the report checks the peak joint rate against, deg/s (default 180). */
  rateLimitDegS: finite('rateLimitDegS').positive().max(2000).default(180),
  /** Time budget, seconds; null: none. */
  timeBudgetS: finite('timeBudgetS').positive().max(3600).nullable().default(null),
};

/**
 * What a sequence must achieve and within which limits (stored as the sequence's `target` jsonb):
 * `{ mode: 'ypr', yprDeg: { yaw, pitch, roll } }` or `{ mode: 'axis_angle', axisAngle: { axis, angleDeg } }`,
 * plus tolerance, rate limit and time budget.
 */
export const sequenceTargetSchema = z.discriminatedUnion('mode', [
  z.object({ mode: z.literal('ypr'), yprDeg: yprDegSchema, ...targetLimits }),
  z.object({ mode: z.literal('axis_angle'), axisAngle: axisAngleSchema, ...targetLimits }),
]);
/** A sequence target (output shape, defaults filled). */
export type SequenceTarget = z.infer<typeof sequenceTargetSchema>;
/** A sequence target as written (limits may be left to their defaults): what the `target` columns hold. */
export type SequenceTargetInput = z.input<typeof sequenceTargetSchema>;

/** POST /sequences */
export const createSequenceRequestSchema = z.object({
  crewMemberId: z.uuid(),
  name: z.string().trim().min(1, 'name is required').max(120),
  target: sequenceTargetSchema,
});
export type CreateSequenceRequest = z.input<typeof createSequenceRequestSchema>;

/**
 * PATCH /sequences/:sequenceId: the name, or the target the next version starts from (each version
 * keeps its own target; 409 `cleared_version` while the latest version is under review or cleared).
 */
export const updateSequenceRequestSchema = z
  .object({
    name: z.string().trim().min(1).max(120).optional(),
    target: sequenceTargetSchema.optional(),
  })
  .refine((v) => v.name !== undefined || v.target !== undefined, { message: 'Give a name or a target to change.' });
export type UpdateSequenceRequest = z.input<typeof updateSequenceRequestSchema>;

/** POST /sequences/:sequenceId/versions */
export const saveVersionRequestSchema = z.object({
  /** The composed primitives, in order. */
  primitives: primitiveListSchema,
  /** The latest version number the editor started from (0 when the sequence has none); else 409. */
  baseVersion: z.number().int().min(0),
  /** Free-text note on what changed. */
  note: z.string().max(2000).default(''),
  /**
   * The target this version is composed for; it stays with the version. Omitted: the sequence's
   * current target. A different one also becomes the sequence's default for the next version.
   */
  target: sequenceTargetSchema.optional(),
});
export type SaveVersionRequest = z.input<typeof saveVersionRequestSchema>;

/** POST /sequences/compile: compile only, for the composer's "show joint steps". */
export const compileRequestSchema = z.object({
  primitives: primitiveListSchema,
  /** Crew member whose current profile gives the dof ranges (optional: standard ranges otherwise). */
  crewMemberId: z.uuid().optional(),
});
export type CompileRequest = z.input<typeof compileRequestSchema>;

/** Which compiled steps came from which primitive (see shared/primitives/compile-primitives.ts). */
export const stepOriginSchema = z.object({
  primitive: z.number().int(),
  role: z.enum(['blend', 'sweep', 'shift', 'pause']),
  startS: z.number(),
  endS: z.number(),
});

/** A stored `compiled` value written as the bare engine sequence (tests and hand-made rows): no cues, no step map. */
const isBareSequence = (v: unknown) => typeof v === 'object' && v !== null && !Array.isArray(v) && !('sequence' in v);

/**
 * The `compiled` column of a sequence version: the engine sequence contract, one cue per compiled
 * step (a joining blend carries its lead-in cue) and which primitive each step came from. A bare
 * `{ start, steps }` reads as that sequence with no cues and no step map.
 */
export const storedCompiledSchema = z.preprocess((v) => (isBareSequence(v) ? { sequence: v } : v), z.object({
  sequence: sequenceSchema,
  cues: z.array(z.string()).default([]),
  stepMap: z.array(stepOriginSchema).default([]),
}));
/** A version's compiled steps as read (defaults filled), and as the save path writes them. */
export type StoredCompiled = z.infer<typeof storedCompiledSchema>;

/** A problem tied to one primitive. */
export const primitiveIssueSchema = z.object({ primitive: z.number().int(), field: z.string(), message: z.string() });

/** Response of POST /sequences/compile. */
export const compileResponseSchema = z.object({
  /** Engine sequence contract: { start, steps }. */
  compiled: z.object({ start: z.record(z.string(), z.number()), steps: z.array(z.unknown()) }),
  stepMap: z.array(stepOriginSchema),
  /** One cue per primitive. */
  cues: z.array(z.string()),
  durationS: z.number(),
  errors: z.array(primitiveIssueSchema),
  warnings: z.array(primitiveIssueSchema),
  /** Every dof of the body compiled for, with its range in degrees (the crew member's current profile, suit included). */
  ranges: z.record(z.string(), z.object({ min: z.number(), max: z.number() })),
});
export type CompileResponse = z.infer<typeof compileResponseSchema>;

/** Time series for the report's plots, sampled at `rateHz` (20 Hz). Arrays share `t`'s length. */
export const reportSeriesSchema = z.object({
  rateHz: z.number(),
  /** Seconds. */
  t: z.array(z.number()),
  /** Attitude as yaw/pitch/roll vs t, degrees (unwrapped: may leave ±180°). */
  yawDeg: z.array(z.number()),
  pitchDeg: z.array(z.number()),
  rollDeg: z.array(z.number()),
  /** Joint angles vs t, degrees, for the dofs that move; `jointsDeg[dof][k]` at `t[k]`. */
  jointsDeg: z.record(z.string(), z.array(z.number())),
  /** Range of each plotted dof, degrees (for range bands). */
  ranges: z.record(z.string(), z.object({ min: z.number(), max: z.number() })),
});

/**
 * A rotation relative to the body's attitude at its start, about the body's axes there (degrees):
 * angle and unit axis in the body frame at the start (x anterior, y left, z head; [1,0,0] for no
 * rotation), the quaternion and the same rotation as yaw/pitch/roll (z-y′-x″).
 */
export const relativeRotationSchema = angleAxisSchema.extend({
  /** {w,x,y,z}, w ≥ 0: composes by quaternion product, earlier steps on the left. */
  quat: attitudeSchema,
  yprDeg: yprSchema,
});
export type RelativeRotation = z.infer<typeof relativeRotationSchema>;

/** One sweep of whole cycles inside a composer step: the rotation of one of its cycles. */
export const sweepRotationSchema = z.object({
  /** Index of the compiled step (engine sequence). */
  compiledStep: z.number().int(),
  cycles: z.number(),
  periodS: z.number(),
  /** Rotation of one cycle from the sweep's starting posture; n cycles rotate by its n-th power. */
  perCycle: relativeRotationSchema,
});

/**
 * Where the rotation comes from: one entry per composer step (its lead-in included). The attitude
 * after the sequence is the product of the steps' rotations in order (zero momentum: a step's
 * rotation depends only on its own shape path and posture at the start).
 */
export const stepRotationSchema = z.object({
  /** Composer step index, 0-based (the composer, player and cue card number it index + 1). */
  step: z.number().int(),
  startS: z.number(),
  endS: z.number(),
  rotation: relativeRotationSchema,
  /** Rotation travelled during the step, ∫|ω| dt from the report's samples, degrees. */
  pathDeg: z.number(),
  sweeps: z.array(sweepRotationSchema),
});
export type StepRotation = z.infer<typeof stepRotationSchema>;

/** What a verification (and a review of it) binds to: the same inputs on the same engine give the same figures. */
export const verificationBindingSchema = z.object({
  /** Engine version (semver+source hash) that computed the report. */
  engineVersion: z.string(),
  /** sha256 (hex) of the canonical JSON of { body, sequence }: reproduces the computation. */
  inputsHash: z.string(),
  /** The profile version the body came from. */
  profileVersionId: z.uuid(),
});
const binding = verificationBindingSchema.shape;

/** The stored verification report of a version. */
export const verificationReportSchema = verificationBindingSchema.extend({
  durationS: z.number(),
  /** Rotation travelled, ∫|ω| dt over the report's samples, degrees (absent in reports made before it was added). */
  pathDeg: z.number().optional(),
  final: finalStateSchema,
  target: z.object({
    /** The target as a quaternion {w,x,y,z}. */
    attitude: attitudeSchema,
    /** Rotation angle between the final and the target attitude, degrees. */
    errorDeg: z.number(),
    toleranceDeg: z.number(),
    withinTolerance: z.boolean(),
  }),
  /** The engine's momentum audit (kg·m²/s). */
  momentum: z.object({ maxAbs: z.number(), relative: z.number(), peakShapeMomentum: z.number(), atTime: z.number() }),
  /** Rotation of each composer step (absent in reports made before it was added). */
  stepRotations: z.array(stepRotationSchema).optional(),
  rangeViolations: z.array(rangeViolationSchema),
  peakJointRate: z.object({
    maxDegS: z.number(),
    dof: z.string().nullable(),
    time: z.number(),
    limitDegS: z.number(),
    withinLimit: z.boolean(),
    byDof: z.record(z.string(), z.number()),
  }),
  timeBudget: z.object({ limitS: z.number().nullable(), within: z.boolean() }),
  solver: z.object({ rhsEvaluations: z.number(), steps: z.number(), relativeTolerance: z.number() }),
  series: reportSeriesSchema,
  /** When the report was computed. */
  computedAt: isoTime,
});
export type VerificationReport = z.infer<typeof verificationReportSchema>;

/** The report as GET /sequences/versions/:id returns it: the stored report plus the version's robustness (its newest run, read live; null when none). */
export const versionReportSchema = verificationReportSchema.extend({ robustness: versionRobustnessSchema.nullable() });
export type VersionReport = z.infer<typeof versionReportSchema>;

/** The headline figures of a report, for lists. */
export const reportSummarySchema = z.object({
  durationS: z.number(),
  targetErrorDeg: z.number(),
  withinTolerance: z.boolean(),
  yprDeg: yprSchema,
  rangeViolationCount: z.number().int(),
  peakJointRateDegS: z.number(),
  withinRateLimit: z.boolean(),
  withinTimeBudget: z.boolean(),
});
export type ReportSummary = z.infer<typeof reportSummarySchema>;

/** A background recomputation against a newer profile version. */
export const reverificationSchema = jobRecordSchema.omit({ progress: true, startedAt: true }).extend({
  id: z.uuid(),
  fromProfileVersionId: z.uuid(),
  toProfileVersionId: z.uuid(),
  /** Angle between the stored and the recomputed final attitude, degrees (null until done). */
  attitudeShiftDeg: z.number().nullable(),
  /** Target error on the new profile, degrees (null until done). */
  targetErrorDeg: z.number().nullable(),
  /** The engine version that recomputed it (null until done). */
  engineVersion: z.string().nullable(),
  /** What it concluded, in words (an engine change: "re-verified under engine X, unchanged …"; null otherwise). */
  outcome: z.string().nullable(),
});
export type Reverification = z.infer<typeof reverificationSchema>;

/** What a stale version's re-check waits for (shared/product/recheck-status.ts RecheckInfo). */
export const recheckInfoSchema = z.object({
  cause: z.enum(['profile', 'engine']).optional(),
  staleSince: isoTime.nullable(),
  reverification: reverificationSchema.pick({ state: true, attitudeShiftDeg: true, error: true }).nullable(),
  successor: z.object({ version: z.number().int(), status: versionStatusSchema, automatic: z.boolean() }).nullable(),
}) satisfies z.ZodType<RecheckInfo>;

/** One version in lists. */
export const versionSummarySchema = z.object({
  id: z.uuid(),
  sequenceId: z.uuid(),
  version: z.number().int(),
  status: versionStatusSchema,
  profileVersionId: binding.profileVersionId,
  /** The bound profile version's number. */
  profileVersion: z.number().int(),
  /** Whether the bound profile version is the crew member's current one. */
  profileIsCurrent: z.boolean(),
  authorId: z.uuid().nullable(),
  authorName: z.string().nullable(),
  note: z.string(),
  /** The target this version was composed and verified for (its own; the sequence's target is the next version's default). */
  target: sequenceTargetSchema,
  createdAt: isoTime,
  submittedAt: isoTime.nullable(),
  clearedBy: z.uuid().nullable(),
  clearedByName: z.string().nullable(),
  clearedAt: isoTime.nullable(),
  staleSince: isoTime.nullable(),
  /** The report's binding (null before verification). */
  engineVersion: binding.engineVersion.nullable(),
  inputsHash: binding.inputsHash.nullable(),
  summary: reportSummarySchema.nullable(),
  /** The latest background recomputation, if any (shows how far a recheck version moved). */
  reverification: reverificationSchema.nullable(),
  /** The submitter's note to the reviewer (null when submitted without one). */
  submitNote: z.string().nullable(),
  /** The failed checks the submitter acknowledged (null: it passed every check when submitted). */
  acknowledgedFailures: z.array(checkFailureSchema).nullable(),
  /** A re-check version: the cleared version it re-checks after a profile change (null otherwise). */
  recheckOfId: z.uuid().nullable(),
  /** The newest robustness run (state, feedback p95, level); null when none was ever queued. */
  robustness: robustnessBriefSchema.nullable(),
});
export type VersionSummary = z.infer<typeof versionSummarySchema>;

/** A review entry. */
export const reviewEntrySchema = z.object({
  id: z.uuid(),
  reviewerId: z.uuid(),
  reviewerName: z.string(),
  /** clear | send_back | comment */
  decision: z.enum(['clear', 'send_back', 'comment']),
  comment: z.string(),
  /** The version's binding when the review was written. */
  profileVersionId: binding.profileVersionId.nullable(),
  engineVersion: binding.engineVersion.nullable(),
  createdAt: isoTime,
});
export type ReviewEntry = z.infer<typeof reviewEntrySchema>;

/** The sequence a version belongs to. */
export const sequenceHeadSchema = z.object({
  id: z.uuid(),
  crewMemberId: z.uuid(),
  crewMemberName: z.string(),
  name: z.string(),
  target: sequenceTargetSchema,
  createdAt: isoTime,
  /** When the maneuver was archived (out of default lists, no new versions); null when active. */
  archivedAt: isoTime.nullable(),
});
export type SequenceHead = z.infer<typeof sequenceHeadSchema>;

/** GET /sequences/versions/:versionId */
export const versionDetailSchema = versionSummarySchema.extend({
  sequence: sequenceHeadSchema,
  primitives: primitiveListSchema,
  /** Cue per primitive. */
  cues: z.array(z.string()),
  /** Engine sequence contract { start, steps }. */
  compiled: sequenceSchema,
  stepMap: z.array(stepOriginSchema),
  report: versionReportSchema.nullable(),
  reviews: z.array(reviewEntrySchema),
  reverifications: z.array(reverificationSchema),
  /** Actions the caller may take now. */
  allowed: z.object({ submit: z.boolean(), decide: z.boolean(), comment: z.boolean() }),
  /** A `recheck` version: what its re-check waits for now (shared/product/recheck-status.ts); null otherwise. */
  recheck: recheckInfoSchema.nullable(),
});
export type VersionDetail = z.infer<typeof versionDetailSchema>;

/** A sequence in lists. */
export const sequenceSummarySchema = sequenceHeadSchema.extend({
  versionCount: z.number().int(),
  /** The newest version the caller may see. */
  latest: versionSummarySchema.nullable(),
  /** The cleared (or recheck, once cleared) version trainees rehearse, if any. */
  cleared: versionSummarySchema.nullable(),
});
export type SequenceSummary = z.infer<typeof sequenceSummarySchema>;

/** The headline figures maneuver lists show of a version's report. */
export const reportBriefSchema = reportSummarySchema.pick({ durationS: true, targetErrorDeg: true, withinTolerance: true, rangeViolationCount: true });
export type ReportBrief = z.infer<typeof reportBriefSchema>;

/** A version as maneuver lists show it: which one, its status and headline figures (the rest on opening it). */
export const versionBriefSchema = z.object({
  id: z.uuid(),
  version: z.number().int(),
  status: versionStatusSchema,
  summary: reportBriefSchema.nullable(),
  /** The newest robustness run's state and level (null: never queued). */
  robustness: robustnessBriefSchema.nullable(),
});
export type VersionBrief = z.infer<typeof versionBriefSchema>;

/** A version named in a list: which one and its status (the maneuver list's rehearsable version). */
export const versionRefSchema = versionBriefSchema.pick({ id: true, version: true, status: true });
export type VersionRef = z.infer<typeof versionRefSchema>;

/** How the trainee's screens (player, rehearsal list) name a version: which version of which maneuver, its status, whose. */
export const versionHeadingSchema = z.object({
  versionId: z.uuid(),
  sequenceId: z.uuid(),
  /** Sequence name and version number, e.g. "Quarter turn left", 3. */
  sequenceName: z.string(),
  version: z.number().int(),
  status: versionStatusSchema,
  /** The crew member whose maneuver (and body) it is. */
  crewMemberName: z.string(),
});
export type VersionHeading = z.infer<typeof versionHeadingSchema>;

/**
 * GET /sequences: a maneuver in the list, lean — what the list screen shows (name, crew member,
 * target, the newest version's status and headline figures, the rehearsable version when it is
 * another); the rest on opening it.
 */
export const sequenceListItemSchema = sequenceHeadSchema.pick({ id: true, crewMemberName: true, name: true, target: true }).extend({
  /** The newest version the caller may see. */
  latest: versionBriefSchema.nullable(),
  /** The cleared (or recheck, once cleared) version trainees rehearse, if any. */
  cleared: versionRefSchema.nullable(),
});
export type SequenceListItem = z.infer<typeof sequenceListItemSchema>;

/** Most maneuvers one page of the list holds. */
export const SEQUENCE_PAGE_MAX = 200;

/**
 * GET /sequences query: filters (crew member, shelf, a search in the maneuver's and crew member's
 * names, the newest version's status) and, with `limit`, one page by name (`after`: the previous
 * page's `next`). Without `limit` every match comes at once.
 */
export const sequenceListQuerySchema = z.object({
  crewMemberId: z.uuid('crewMemberId: not a valid id.').optional(),
  /** `true` lists the archived maneuvers (and those of archived crew members) instead of the active ones. */
  archived: z.enum(['true', 'false'], { error: 'use true or false.' }).optional().transform((v) => v === 'true'),
  /** Part of a maneuver's or crew member's name, any case. */
  q: z.string().trim().max(200, 'at most 200 characters.').optional().transform((v) => v || undefined),
  status: versionStatusSchema.optional(),
  limit: z.coerce.number({ error: 'a whole number.' }).int('a whole number.').min(1, 'at least 1.').max(SEQUENCE_PAGE_MAX, `at most ${SEQUENCE_PAGE_MAX}.`).optional(),
  after: z.string().max(1000, 'not a page mark of this list.').optional(),
});
export type SequenceListQuery = z.input<typeof sequenceListQuerySchema>;

/** GET /sequences answer: the maneuvers by name; `next` asks for the following page (null: no more). */
export const sequenceListResponseSchema = z.object({
  sequences: z.array(sequenceListItemSchema),
  next: z.string().nullable(),
});
export type SequenceListResponse = z.infer<typeof sequenceListResponseSchema>;

/** GET /sequences/:sequenceId */
export const sequenceDetailSchema = sequenceSummarySchema.extend({
  /** Versions the caller may see, newest first. */
  versions: z.array(versionSummarySchema),
});
export type SequenceDetail = z.infer<typeof sequenceDetailSchema>;

/**
 * POST /sequences/versions/:versionId/submit. A version that fails a check (target, ranges, rate
 * limit, time budget, robustness not computed: shared/product/version-checks.ts) is refused with 409
 * `checks_failed` naming every failure, unless the request carries `acknowledgeFailures: true` and a
 * note for the reviewer, who then sees both first.
 */
export const submitRequestSchema = z.object({
  /** A note for the reviewer; required (non-blank) with `acknowledgeFailures`. */
  note: z.string().trim().max(2000).optional(),
  /** The submitter knows the version fails the checks the server names and submits it anyway. */
  acknowledgeFailures: z.boolean().optional(),
});
export type SubmitRequest = z.input<typeof submitRequestSchema>;

/** POST /reviews/:versionId/decision; `send_back` needs a comment. */
export const reviewDecisionRequestSchema = z
  .object({
    decision: z.enum(['clear', 'send_back']),
    comment: z.string().trim().max(4000).default(''),
  })
  .refine((r) => r.decision !== 'send_back' || r.comment.length > 0, { path: ['comment'], message: 'say why the version is sent back' });
export type ReviewDecisionRequest = z.input<typeof reviewDecisionRequestSchema>;

/** POST /reviews/:versionId/comments */
export const reviewCommentRequestSchema = z.object({ comment: z.string().trim().min(1, 'comment is required').max(4000) });
export type ReviewCommentRequest = z.input<typeof reviewCommentRequestSchema>;

/** GET /reviews/queue item: a version under review with its sequence. */
export const reviewQueueItemSchema = z.object({ version: versionSummarySchema, sequence: sequenceHeadSchema });
export type ReviewQueueItem = z.infer<typeof reviewQueueItemSchema>;

/** One primitive position in a comparison. */
export const primitiveChangeSchema = z.object({
  index: z.number().int(),
  change: z.enum(['same', 'changed', 'added', 'removed']),
  /** Cue in version a / b (null where absent). */
  a: z.string().nullable(),
  b: z.string().nullable(),
});

/** a, b and b − a of one figure. */
const figureDelta = z.object({ a: z.number().nullable(), b: z.number().nullable(), delta: z.number().nullable() });

/** GET /sequences/versions/:a/compare/:b */
export const compareResponseSchema = z.object({
  a: versionSummarySchema,
  b: versionSummarySchema,
  sameProfile: z.boolean(),
  sameEngine: z.boolean(),
  /** Primitives compared position by position. */
  primitives: z.array(primitiveChangeSchema),
  result: z.object({
    durationS: figureDelta,
    targetErrorDeg: figureDelta,
    yawDeg: figureDelta,
    pitchDeg: figureDelta,
    rollDeg: figureDelta,
    peakJointRateDegS: figureDelta,
    rangeViolationCount: figureDelta,
    /** Angle between the two final attitudes, degrees (null if either has no report). */
    finalAttitudeShiftDeg: z.number().nullable(),
  }),
});
export type CompareResponse = z.infer<typeof compareResponseSchema>;

/**
 * GET /api/crew/:id/reverifications — the re-verification of a crew member's maneuvers after their
 * latest profile change, as one piece of background work: counts by state, progress and each version.
 */
export interface ReverificationProgress {
  /** The profile version the versions are recomputed on (null: nothing was ever re-verified). */
  toProfileVersionId: string | null;
  toProfileVersion: number | null;
  total: number;
  queued: number;
  running: number;
  done: number;
  failed: number;
  cancelled: number;
  /** Ended share of the total, 0–1 (1 when there is nothing to do). */
  progress: number;
  items: {
    id: string;
    sequenceId: string;
    sequenceName: string;
    version: number;
    state: Reverification['state'];
    attitudeShiftDeg: number | null;
    error: string | null;
  }[];
}
