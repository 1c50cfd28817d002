import theme from '../../../tailwind.config';
import { escapeHtml } from './escape-html';

// Mail clients ignore style sheets from elsewhere and most <style> blocks, so messages carry inline
// styles; the colours are the product's theme tokens, read from the one place they are defined.
const { colors } = theme.theme.extend;
/** The theme colours by the role they play in a message. */
export const mailColors = {
  page: colors.paper[100],
  card: colors.paper[50],
  rule: colors.paper[200],
  text: colors.ink[900],
  muted: colors.ink[500],
  brand: colors.lagoon[900],
  brandText: colors.lagoon[50],
  link: colors.lagoon[600],
  action: colors.ember[500],
  actionText: colors.paper[50],
  danger: colors.signal.danger,
  fine: colors.signal.fine,
} as const;

const fontStack = `'Public Sans', system-ui, -apple-system, 'Segoe UI', sans-serif`;

/** What goes into the common frame of every message. */
export interface MailFrame {
  /** The document title and first heading. */
  title: string;
  /** A one-line summary that mail clients show beside the subject. */
  preheader: string;
  /** The message's content, already-escaped HTML. */
  bodyHtml: string;
  /** Small print under the content (why the reader got it, how to stop it), already-escaped HTML. */
  footerHtml: string;
}

/**
 * Wraps a message's content in the product's mail frame: a table layout (what mail clients render
 * reliably), the name as a header band, the content and the small print.
 *
 * @param frame title, preheader, content and footer
 * @returns a complete HTML document
 */
export function renderMailHtml(frame: MailFrame): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(frame.title)}</title>
</head>
<body style="margin:0;padding:0;background:${mailColors.page};color:${mailColors.text};font-family:${fontStack};font-size:15px;line-height:1.5">
<div style="display:none;max-height:0;overflow:hidden">${escapeHtml(frame.preheader)}</div>
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" style="background:${mailColors.page}">
<tr><td align="center" style="padding:24px 12px">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" style="max-width:680px;background:${mailColors.card};border:1px solid ${mailColors.rule};border-radius:8px">
<tr><td style="background:${mailColors.brand};color:${mailColors.brandText};padding:14px 24px;font-size:18px;font-weight:600;border-radius:8px 8px 0 0">Kcatalog</td></tr>
<tr><td style="padding:24px">
<h1 style="margin:0 0 16px;font-size:20px;line-height:1.3">${escapeHtml(frame.title)}</h1>
${frame.bodyHtml}
</td></tr>
<tr><td style="padding:16px 24px;border-top:1px solid ${mailColors.rule};color:${mailColors.muted};font-size:12px">${frame.footerHtml}</td></tr>
</table>
</td></tr>
</table>
</body>
</html>
`;
}

/**
 * A call-to-action link styled as a button, with the address written out below it for clients that
 * hide links.
 *
 * @param href the absolute URL
 * @param label the button text
 * @returns HTML
 */
export function mailButton(href: string, label: string): string {
  const url = escapeHtml(href);
  return `<p style="margin:20px 0"><a href="${url}" style="display:inline-block;background:${mailColors.action};color:${mailColors.actionText};padding:10px 18px;border-radius:6px;font-weight:600;text-decoration:none">${escapeHtml(label)}</a></p>
<p style="margin:0 0 16px;font-size:13px;color:${mailColors.muted}">Or open this address: <a href="${url}" style="color:${mailColors.link};word-break:break-all">${url}</a></p>`;
}

/**
 * A paragraph of already-escaped HTML.
 *
 * @param html content
 * @returns HTML
 */
export function mailParagraph(html: string): string {
  return `<p style="margin:0 0 12px">${html}</p>`;
}
