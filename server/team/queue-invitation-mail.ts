import type { AppContext } from '../app-context.ts';
import { INVITATION_MAIL_RETRY_LIMIT } from '../jobs/queue-names.ts';
import { deliverInvitation } from './deliver-invitation.ts';

/**
 * Hands an invitation (state `sending`) to the outbox job. The row is committed first, so if the
 * queue cannot take the job now, the supervisor's sweep (server/jobs/reconcile-work.ts) sends it
 * later. Without a job queue (tests, tools) the one attempt runs in the background.
 */
export async function queueInvitationMail(ctx: AppContext, invitationId: string): Promise<void> {
  if (ctx.jobs?.enqueueInvitationMail) {
    try {
      await ctx.jobs.enqueueInvitationMail(invitationId);
    } catch (err) {
      ctx.logger.warn({ err, invitationId }, 'invitation e-mail not queued; the sweep will queue it');
    }
    return;
  }
  void deliverInvitation(ctx, { invitationId }, { attempt: INVITATION_MAIL_RETRY_LIMIT, retryLimit: INVITATION_MAIL_RETRY_LIMIT })
    .catch((err: unknown) => ctx.logger.error({ err, invitationId }, 'invitation e-mail failed'));
}
