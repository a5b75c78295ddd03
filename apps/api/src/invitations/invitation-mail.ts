import { INVITATION_TTL_DAYS } from '@cribra/contracts';
import { composeMail, type ComposedMail } from '../mail/compose-mail';

export interface InvitationMailInput {
  inviterName: string;
  notebookTitle: string;
  role: string;
  message: string;
  link: string;
  /** YYYY-MM-DD. */
  expires: string;
}

/** The invitation mail: who invites, to what, as what; the link as a button (HTML) and as text. */
export function invitationMail(i: InvitationMailInput): ComposedMail & { subject: string } {
  return {
    subject: `${i.inviterName} invites you to the Cribra notebook "${i.notebookTitle}"`,
    ...composeMail({
      greeting: 'Hello,',
      intro: [
        `${i.inviterName} invites you to join the notebook "${i.notebookTitle}" on Cribra as ${i.role}.`,
        ...(i.message ? ['Their note:'] : []),
      ],
      quote: i.message || undefined,
      link: { href: i.link, label: 'Sign in (or create an account with this address) and join' },
      outro: [
        `The link works once and expires on ${i.expires} (${INVITATION_TTL_DAYS} days). If you do not know the sender, ignore this message.`,
      ],
    }),
  };
}
