import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { MailFrame } from '@/components/ui/mail-frame';

function frameAttributes(html: string): { sandbox: string | null; srcdoc: string } {
  const markup = renderToStaticMarkup(<MailFrame html={html} title="A message" />);
  const sandbox = /sandbox="([^"]*)"/.exec(markup)?.[1] ?? null;
  const srcdoc = (/srcDoc="([^"]*)"/i.exec(markup)?.[1] ?? '').replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&quot;/g, '"').replace(/&amp;/g, '&');
  return { sandbox, srcdoc };
}

describe('MailFrame', () => {
  // HTML Living Standard, the iframe sandbox attribute: without allow-scripts no script runs, without
  // allow-same-origin the document gets an opaque origin and cannot reach the app.
  it('sandboxes the message without scripts or same-origin access', () => {
    const { sandbox } = frameAttributes('<p>Hello</p><script>parent.alert(1)</script>');
    expect(sandbox).not.toBeNull();
    const tokens = sandbox!.split(/\s+/);
    expect(tokens).not.toContain('allow-scripts');
    expect(tokens).not.toContain('allow-same-origin');
    expect(tokens).toContain('allow-popups');
  });

  it('makes links open outside the frame, inside the head of a full document', () => {
    expect(frameAttributes('<!doctype html><html><head><title>x</title></head><body>y</body></html>').srcdoc).toBe(
      '<!doctype html><html><head><base target="_blank"><title>x</title></head><body>y</body></html>',
    );
    expect(frameAttributes('<p>fragment</p>').srcdoc).toBe('<base target="_blank"><p>fragment</p>');
  });
});
