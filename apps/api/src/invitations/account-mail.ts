import type { PersonTokenPurpose } from '@millrace/contracts';
import type { OutgoingMail } from '../mail/outbox.repository';

/** Where each link points in the planner (the page reads the token and asks for a password). */
export const accountLinks: Record<PersonTokenPurpose, (base: string, token: string) => string> = {
  invitation: (base, token) => `${base}/welcome?token=${token}`,
  password_reset: (base, token) => `${base}/reset-password?token=${token}`,
};

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** The invitation or reset e-mail, in our own words, plain text and HTML with the same link. */
export function accountMail(purpose: PersonTokenPurpose, to: { email: string; name: string }, link: string, expiresAt: Date, invitedBy?: string): OutgoingMail {
  const until = `${expiresAt.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
  const c =
    purpose === 'invitation'
      ? {
          subject: 'You are invited to Millrace',
          lines: [`Hello ${to.name},`, `${invitedBy ?? 'An administrator'} has given you an account on Millrace.`, `Choose your password with the link below; it works once, until ${until}.`],
          linkText: 'Choose your password',
        }
      : {
          subject: 'Choose a new Millrace password',
          lines: [`Hello ${to.name},`, 'Someone asked to reset the password of your Millrace account.', `If it was you, choose a new password with the link below; it works once, until ${until}. If it was not you, ignore this e-mail.`],
          linkText: 'Choose a new password',
        };
  return {
    to: [to.email],
    subject: c.subject,
    text: [...c.lines, '', `${c.linkText}: ${link}`, '', '— Millrace'].join('\n'),
    html: [...c.lines.map((l) => `<p>${escapeHtml(l)}</p>`), `<p><a href="${escapeHtml(link)}">${escapeHtml(c.linkText)}</a></p>`, '<p>— Millrace</p>'].join('\n'),
    event: purpose === 'invitation' ? 'person.invited' : 'person.password_reset',
    planId: null,
  };
}
