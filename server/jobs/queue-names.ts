/** The job queues and their retry limits (one place, so services can send without importing the queue runner). */

/** Queue name of re-verification jobs. */
export const REVERIFY_QUEUE = 'sequence-reverification';
/** Retries after a failed attempt (so up to 1 + this many attempts), with exponential backoff from 2 s. */
export const REVERIFY_RETRY_LIMIT = 3;

/** Queue name of planning jobs. */
export const PLAN_QUEUE = 'maneuver-planning';
/**
 * Planning is deterministic, so a planner failure is stored on the plan and never retried; these
 * retries are for a worker that died mid-plan (its heartbeat stopped).
 */
export const PLAN_RETRY_LIMIT = 2;

/** Queue name of robustness-run chunks. */
export const ROBUSTNESS_CHUNK_QUEUE = 'robustness-chunk';
/** Retries of a chunk whose worker died (a failure inside the model fails the run at once). */
export const CHUNK_RETRY_LIMIT = 3;

/** Queue name of invitation e-mails (the invitation row is the outbox). */
export const INVITATION_MAIL_QUEUE = 'invitation-mail';
/** Retries of a failed send, with exponential backoff from the retry delay (2, 4, 8, 16 s by default). */
export const INVITATION_MAIL_RETRY_LIMIT = 4;

/** Every queue a worker consumes. */
export const ALL_QUEUES = [REVERIFY_QUEUE, PLAN_QUEUE, ROBUSTNESS_CHUNK_QUEUE, INVITATION_MAIL_QUEUE] as const;
export type QueueName = (typeof ALL_QUEUES)[number];
