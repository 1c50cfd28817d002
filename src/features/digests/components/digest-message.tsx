import { useState } from 'react';
import { MailFrame } from '@/components/ui/mail-frame';
import { Tabs } from '@/components/ui/tabs';

/** A digest as its reader sees it: the HTML part in a sandboxed frame, or the plain-text part. */
export function DigestMessage({ subject, html, text }: { subject: string; html: string; text: string }) {
  const [view, setView] = useState<'html' | 'text'>('html');
  return (
    <div className="space-y-3">
      <p className="text-sm">
        <span className="text-ink-500">Subject: </span>
        <span className="font-medium">{subject}</span>
      </p>
      <Tabs
        label="Digest parts"
        tabs={[
          { id: 'html', label: 'HTML part' },
          { id: 'text', label: 'Plain text' },
        ]}
        selected={view}
        onSelect={setView}
      />
      {view === 'html' ? (
        <MailFrame html={html} title={`Digest: ${subject}`} className="h-[44rem]" />
      ) : (
        <pre className="max-h-[44rem] overflow-auto whitespace-pre rounded-md bg-paper-50 p-4 font-mono text-xs text-ink-900">{text}</pre>
      )}
    </div>
  );
}
