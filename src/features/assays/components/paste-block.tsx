import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import type { ParsedBlock } from '../lib/parse-pasted-block';

export interface PasteBlockProps {
  id: string;
  /** A two-line example block, header and one row, tab-separated. */
  placeholder: string;
  text: string;
  onTextChange: (text: string) => void;
  /** Called with a pasted block at once, or with the typed text on the button. */
  onRead: (text: string) => void;
  /** What reading the last block found, shown under the box. */
  report: Pick<ParsedBlock, 'notes' | 'problems'> | null;
}

/** The box a spreadsheet block is pasted into, above the point grid, with what was read from it. */
export function PasteBlock({ id, placeholder, text, onTextChange, onRead, report }: PasteBlockProps) {
  return (
    <>
      <div className="space-y-1">
        <label htmlFor={id} className="block text-sm font-medium text-ink-700">
          Paste a block from a spreadsheet
        </label>
        <textarea
          id={id}
          rows={2}
          placeholder={placeholder}
          value={text}
          onChange={(event) => onTextChange(event.target.value)}
          onPaste={(event) => {
            event.preventDefault();
            onRead(event.clipboardData.getData('text/plain'));
          }}
          className="block w-full rounded-md border border-paper-300 px-3 py-2 font-mono text-xs placeholder:text-ink-400 focus:border-lagoon-500 focus:outline-none focus:ring-2 focus:ring-lagoon-200"
        />
        {text.trim() !== '' && (
          <Button onClick={() => onRead(text)} className="mt-1">
            Put the block into the grid
          </Button>
        )}
      </div>
      {report && (
        <Notice tone={report.problems.length > 0 ? 'caution' : 'info'} title={report.problems.length > 0 ? 'Part of the block could not be read' : 'Block read'}>
          <ul className="list-disc pl-4">
            {[...report.notes, ...report.problems].map((line) => (
              <li key={line}>{line}</li>
            ))}
          </ul>
        </Notice>
      )}
    </>
  );
}
