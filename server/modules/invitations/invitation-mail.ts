import { roleLabels, type Role } from '@shared/auth/permissions';
import { escapeHtml } from '../mail/escape-html';
import { mailButton, mailParagraph, renderMailHtml } from '../mail/mail-layout';
import { formatMailDateTime, type MailOptions } from '../mail/mail-options';

/**
 * The invitation message: who invited whom with which role, the single-use link and when it expires.
 *
 * @param invitation address, role, inviter's name, link and expiry
 * @param mail the installation's mail options (time zone)
 * @returns subject, plain text and HTML
 */
export function renderInvitationMail(
  invitation: { email: string; role: Role; inviterName: string; url: string; expiresAt: Date },
  mail: Pick<MailOptions, 'timezone'>,
): { subject: string; text: string; html: string } {
  const role = roleLabels[invitation.role];
  const expires = formatMailDateTime(invitation.expiresAt, mail.timezone);
  const subject = `${invitation.inviterName} invited you to Kcatalog`;
  const text = [
    'Hello,',
    '',
    `${invitation.inviterName} invited you (${invitation.email}) to Kcatalog as ${role}. Kcatalog is where your team registers enzyme variants, their kinetic measurements and the weekly ranking.`,
    '',
    'Choose your name and password here:',
    invitation.url,
    '',
    `The link works once, until ${expires}.`,
    '',
    'If you did not expect this invitation, ignore this message: no account is created until the link is used.',
  ].join('\n');
  const html = renderMailHtml({
    title: 'You are invited to Kcatalog',
    preheader: `${invitation.inviterName} invited you as ${role}.`,
    bodyHtml: [
      mailParagraph(
        `${escapeHtml(invitation.inviterName)} invited you (<strong>${escapeHtml(invitation.email)}</strong>) to Kcatalog as <strong>${escapeHtml(role)}</strong>. Kcatalog is where your team registers enzyme variants, their kinetic measurements and the weekly ranking.`,
      ),
      mailButton(invitation.url, 'Choose your name and password'),
      mailParagraph(`The link works once, until ${escapeHtml(expires)}.`),
    ].join('\n'),
    footerHtml: 'If you did not expect this invitation, ignore this message: no account is created until the link is used.',
  });
  return { subject, text, html };
}
