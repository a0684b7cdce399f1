import type { Config } from '../../config';
import { appUrl, renderMail, type OutgoingMail } from '../mail/index';
import type { Role } from '../../../../shared/src/index';

export interface InvitationMailInput {
  to: string;
  token: string;
  role: Role;
  invitedByName: string;
  /** The contractor company joined, or null for staff. */
  company: string | null;
  branchNames: string[];
  expiresAt: Date;
}

const AS_ROLE: Record<Role, string> = {
  contractor: 'a contractor',
  tech: 'a desk tech',
  specialist: 'a product specialist',
  admin: 'a desk manager',
};

const day = (d: Date) =>
  d.toLocaleDateString('en-US', { weekday: 'long', month: 'long', day: 'numeric', timeZone: 'UTC' });

/** The invitation e-mail: who invites you to what, and the single-use link (7 days). */
export function invitationMail(config: Pick<Config, 'APP_URL'>, m: InvitationMailInput): OutgoingMail {
  const place = m.company
    ? `${m.company}'s account`
    : `the support desk as ${AS_ROLE[m.role]}${m.branchNames.length ? ` (${m.branchNames.join(', ')})` : ''}`;
  const content = renderMail({
    heading: 'You are invited to Lightoff',
    paragraphs: [
      `${m.invitedByName} invited you to join ${place} in Lightoff, the technical support desk for heating and cooling work.`,
      'Open the link, type your name and choose a password to finish. The link works once and ' +
        `until ${day(m.expiresAt)} (7 days).`,
    ],
    action: { label: 'Join Lightoff', url: appUrl(config, `/join/${m.token}`) },
    footer:
      `You got this e-mail because ${m.invitedByName} entered this address. ` +
      'If you did not expect it, ignore it: nothing happens unless the link is used.',
  });
  return { to: m.to, subject: `${m.invitedByName} invited you to Lightoff`, ...content };
}
