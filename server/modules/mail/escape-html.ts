const replacements: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/**
 * Escapes text for HTML element content and quoted attribute values, so that whatever a person typed
 * (a variant note, a campaign name) arrives in a message as text, never as markup.
 *
 * Reference: OWASP Cross Site Scripting Prevention Cheat Sheet, rule 1 (HTML entity encoding of & < > " ').
 *
 * @param text any text
 * @returns the escaped text
 * @example escapeHtml('<script>alert("x")</script>') // '&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt;'
 */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (character) => replacements[character]);
}
