/** E-mails of the review flow: a submission to every reviewer, a decision to the author. */
import { CLIENT_ROUTES } from '../../shared/contracts/maneuver.ts';

/** A message for the mailer. */
export interface ReviewMail {
  to: string;
  subject: string;
  text: string;
}

/** Tells a reviewer a version awaits review; links to `<PUBLIC_URL>/reviews/<versionId>`. */
export function submissionMail(a: { to: string; reviewerName: string; authorName: string; sequenceName: string; version: number; crewMemberName: string; versionId: string; baseUrl: string }): ReviewMail {
  const link = `${a.baseUrl}${CLIENT_ROUTES.review(a.versionId)}`;
  return {
    to: a.to,
    subject: `Review requested: ${a.sequenceName} v${a.version} (${a.crewMemberName})`,
    text: [
      `Hello ${a.reviewerName},`,
      '',
      `${a.authorName} submitted version ${a.version} of the maneuver "${a.sequenceName}" for ${a.crewMemberName}.`,
      'Open its verification report and clear it or send it back:',
      link,
      '',
      'Holonaut is a planning and training aid; flight rules and certified procedures take precedence.',
    ].join('\n'),
  };
}

/** Tells the author the decision; links to the version in the maneuvers screen. */
export function decisionMail(a: { to: string; authorName: string; reviewerName: string; sequenceName: string; version: number; decision: 'clear' | 'send_back'; comment: string; sequenceId: string; versionId: string; baseUrl: string }): ReviewMail {
  const link = `${a.baseUrl}${CLIENT_ROUTES.version(a.sequenceId, a.versionId)}`;
  const verdict = a.decision === 'clear' ? 'cleared' : 'sent back';
  return {
    to: a.to,
    subject: `${a.sequenceName} v${a.version} was ${verdict}`,
    text: [
      `Hello ${a.authorName},`,
      '',
      `${a.reviewerName} ${verdict} version ${a.version} of "${a.sequenceName}".`,
      ...(a.comment ? ['', `Comment: ${a.comment}`] : []),
      '',
      link,
    ].join('\n'),
  };
}

/** Tells a reviewer an automatic re-check version waits for their decision. */
export function recheckMail(a: { to: string; reviewerName: string; sequenceName: string; version: number; crewMemberName: string; attitudeShiftDeg: number | null; versionId: string; baseUrl: string }): ReviewMail {
  const link = `${a.baseUrl}${CLIENT_ROUTES.review(a.versionId)}`;
  const moved = a.attitudeShiftDeg === null ? '' : ` The final attitude moved ${a.attitudeShiftDeg.toFixed(2)}°.`;
  return {
    to: a.to,
    subject: `Re-check: ${a.sequenceName} v${a.version} (${a.crewMemberName})`,
    text: [
      `Hello ${a.reviewerName},`,
      '',
      `${a.crewMemberName}'s inertia profile changed, so the cleared maneuver "${a.sequenceName}" was re-verified on the new profile and saved as version ${a.version}.${moved}`,
      `${a.crewMemberName} cannot rehearse it until a reviewer clears it again. See what changed and decide:`,
      link,
      '',
      'Holonaut is a planning and training aid; flight rules and certified procedures take precedence.',
    ].join('\n'),
  };
}
