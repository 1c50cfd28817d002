import { useState, type ReactNode } from 'react';
import { MailFrame } from '@/components/ui/mail-frame';
import { Tabs } from '@/components/ui/tabs';

type View = 'html' | 'text' | 'headers';

/** One message: its envelope facts, then the HTML part (sandboxed), the plain-text part or the headers. */
export function MessageView({
  subject,
  facts,
  html,
  text,
  headers,
}: {
  subject: string;
  facts: { label: string; value: ReactNode }[];
  html: string | null;
  text: string;
  headers: { name: string; value: string }[];
}) {
  const [view, setView] = useState<View>(html ? 'html' : 'text');
  const tabs = [...(html ? [{ id: 'html' as const, label: 'HTML part' }] : []), { id: 'text' as const, label: 'Plain text' }, { id: 'headers' as const, label: 'Headers' }];
  return (
    <article aria-label={`Message: ${subject}`} className="space-y-4 rounded-lg border border-paper-200 bg-white p-5 shadow-card">
      <h2 className="text-lg font-semibold text-ink-900">{subject || '(no subject)'}</h2>
      <dl className="grid grid-cols-[7rem_1fr] gap-x-3 gap-y-1 text-sm">
        {facts.map((fact) => (
          <div key={fact.label} className="contents">
            <dt className="text-ink-500">{fact.label}</dt>
            <dd className="break-all text-ink-900">{fact.value}</dd>
          </div>
        ))}
      </dl>
      <Tabs label="Message parts" tabs={tabs} selected={view} onSelect={setView} />
      {view === 'html' && html && <MailFrame html={html} title={`HTML part of “${subject}”`} />}
      {view === 'text' && <pre className="max-h-[36rem] overflow-auto whitespace-pre-wrap rounded-md bg-paper-50 p-4 font-mono text-xs text-ink-900">{text || '(empty)'}</pre>}
      {view === 'headers' && (
        <table className="w-full text-xs">
          <tbody className="divide-y divide-paper-200">
            {headers.map((header, index) => (
              <tr key={`${header.name}-${index}`}>
                <th scope="row" className="w-48 py-1 pr-3 text-left align-top font-mono font-semibold text-ink-700">
                  {header.name}
                </th>
                <td className="break-all py-1 font-mono text-ink-900">{header.value}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </article>
  );
}
