import { type Role, ROLE_LABELS } from '../../shared/contracts/roles.ts';
import type { OutgoingMail } from '../mail/mailer.ts';

/** The invitation e-mail: plain text with the one link to follow. */
export function invitationMail(args: { to: string; name: string; role: Role; invitedBy: string; link: string }): OutgoingMail {
  const text = [
    `Hello ${args.name},`,
    '',
    `${args.invitedBy} invited you to Holonaut as ${ROLE_LABELS[args.role].toLowerCase()}.`,
    'Open this link to choose your password and sign in (it works once and expires in 7 days):',
    '',
    args.link,
    '',
    'Holonaut is a planning and training aid. Follow your program\'s flight rules and certified procedures.',
  ].join('\n');
  return { to: args.to, subject: 'Your Holonaut invitation', text };
}
