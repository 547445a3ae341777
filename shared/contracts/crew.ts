import { z } from 'zod';

import { profileInputsSchema } from './profile-inputs.ts';
import type { SuitConfig } from './suit.ts';

/** POST /api/crew — a new crew member (no profile yet; save version 1 next). */
export const createCrewMemberRequestSchema = z.object({
  /** Full name as shown in lists. */
  name: z.string().trim().min(1, 'Enter the crew member\'s name.').max(120, 'Use at most 120 characters.'),
  /** Short call name, e.g. a station call sign; optional. */
  callSign: z.string().trim().max(40, 'Use at most 40 characters.').optional().default(''),
  /** Free notes. */
  notes: z.string().max(4000).optional().default(''),
});
/** A validated create request. */
export type CreateCrewMemberRequest = z.infer<typeof createCrewMemberRequestSchema>;
/** A create request as the client sends it. */
export type CreateCrewMemberInput = z.input<typeof createCrewMemberRequestSchema>;

/** GET /api/crew?q= — optional search in name and call sign. */
export const crewListQuerySchema = z.object({
  q: z.string().trim().max(120).optional(),
  /** `true` lists the archived members instead of the active ones. */
  archived: z.enum(['true', 'false'], { error: 'archived: use true or false.' }).optional().transform((v) => v === 'true'),
});

/**
 * The editable profile inputs: the shared profile-inputs schema with the suit chosen by the id of a
 * stored suit configuration (GET /api/suits) instead of embedded. The server embeds a snapshot of
 * that configuration in the saved version, so a version stays self-contained when the suit changes.
 */
export const profileFormInputsSchema = profileInputsSchema.omit({ suit: true }).extend({
  /** Id of a stored suit configuration (uuid), or null for none. */
  suitId: z.string().uuid('Choose a suit from the list.').nullable().default(null),
});
/** Validated form inputs (defaults applied). */
export type ProfileFormInputs = z.infer<typeof profileFormInputsSchema>;
/** Form inputs as the client sends them. */
export type ProfileFormInputsInput = z.input<typeof profileFormInputsSchema>;

/**
 * POST /api/crew/:id/versions — save a new profile version on top of `baseVersion` (the version the
 * editor was opened on; 0 when the member has none yet). A base that is no longer the latest gets
 * 409 `stale_version`: nothing is saved.
 */
export const saveProfileRequestSchema = z.object({
  /** The latest version number the editor started from (0: none yet). */
  baseVersion: z.number().int().min(0),
  /** What changed and why, shown in the history. */
  note: z.string().trim().max(2000, 'Use at most 2000 characters.').default(''),
  inputs: profileFormInputsSchema,
});
/** A validated save request. */
export type SaveProfileRequest = z.infer<typeof saveProfileRequestSchema>;
/** A save request as the client sends it. */
export type SaveProfileInput = z.input<typeof saveProfileRequestSchema>;

/** A crew member as listed. */
export interface CrewMemberView {
  id: string;
  name: string;
  callSign: string | null;
  notes: string;
  /** Number of the current (latest) profile version; null before the first save. */
  currentVersion: number | null;
  /** Whole-body mass of the current version, kg (body + suit + gear); null before the first save. */
  currentMass: number | null;
  /** Name of the suit in the current version, if any. */
  currentSuit: string | null;
  createdAt: string;
  /** When the member was archived (out of default lists, no new profile versions); null when active. */
  archivedAt: string | null;
}

/** A stored suit configuration as the API returns it (GET /api/suits). */
export interface SuitView {
  /** Row id (uuid): what a profile's `suitId` refers to. */
  id: string;
  /** The configuration (shared/contracts/suit.ts); `config.id` is its stable slug. */
  config: SuitConfig;
  /** Stored version, 1 upwards; an edit sends it back as `baseVersion`. */
  version: number;
  updatedAt: string;
  updatedByName: string | null;
}
