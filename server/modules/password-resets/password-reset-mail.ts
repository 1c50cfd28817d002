import { passwordResetLifetimeMinutes } from '@shared/schemas/password-reset';
import { escapeHtml } from '../mail/escape-html';
import { mailButton, mailParagraph, renderMailHtml } from '../mail/mail-layout';
import { formatMailDateTime, type MailOptions } from '../mail/mail-options';

/**
 * The password-reset message: the single-use link, its expiry, and what to do when the reader did not ask.
 *
 * @param reset the user's name, the link and its expiry
 * @param mail the installation's mail options (time zone)
 * @returns subject, plain text and HTML
 */
export function renderPasswordResetMail(
  reset: { name: string; url: string; expiresAt: Date },
  mail: Pick<MailOptions, 'timezone'>,
): { subject: string; text: string; html: string } {
  const expires = formatMailDateTime(reset.expiresAt, mail.timezone);
  const subject = 'Set a new Kcatalog password';
  const text = [
    `Hello ${reset.name},`,
    '',
    'Someone (probably you) asked to set a new password for your Kcatalog account. Choose one here:',
    reset.url,
    '',
    `The link works once, for ${passwordResetLifetimeMinutes} minutes (until ${expires}). Setting a new password signs you out everywhere.`,
    '',
    'If you did not ask for this, ignore this message: your password stays as it is.',
  ].join('\n');
  const html = renderMailHtml({
    title: 'Set a new password',
    preheader: `The link works for ${passwordResetLifetimeMinutes} minutes.`,
    bodyHtml: [
      mailParagraph(`Hello ${escapeHtml(reset.name)},`),
      mailParagraph('Someone (probably you) asked to set a new password for your Kcatalog account.'),
      mailButton(reset.url, 'Choose a new password'),
      mailParagraph(
        `The link works once, for ${passwordResetLifetimeMinutes} minutes (until ${escapeHtml(expires)}). Setting a new password signs you out everywhere.`,
      ),
    ].join('\n'),
    footerHtml: 'If you did not ask for this, ignore this message: your password stays as it is.',
  });
  return { subject, text, html };
}
