/**
 * Shows the HTML part of a message in a sandboxed frame: `sandbox` without `allow-scripts` or
 * `allow-same-origin`, so nothing in a message can run or reach the app; links open in a new tab.
 */
export function MailFrame({ html, title, className = 'h-[36rem]' }: { html: string; title: string; className?: string }) {
  // A <base target> inside the document makes links leave the frame instead of navigating inside it.
  const base = '<base target="_blank">';
  const document = /<head[^>]*>/i.test(html) ? html.replace(/<head[^>]*>/i, (head) => `${head}${base}`) : `${base}${html}`;
  return (
    <iframe
      title={title}
      sandbox="allow-popups allow-popups-to-escape-sandbox"
      referrerPolicy="no-referrer"
      srcDoc={document}
      className={`w-full rounded-md border border-paper-200 bg-white ${className}`}
    />
  );
}
