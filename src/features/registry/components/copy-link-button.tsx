import { useEffect, useState } from 'react';
import { Button } from '@/components/ui/button';

type CopyState = 'idle' | 'copied' | 'unavailable';

/** Copies the page address, which holds the whole view, so it can be sent to a colleague. */
export function CopyLinkButton() {
  const [state, setState] = useState<CopyState>('idle');

  useEffect(() => {
    if (state === 'idle') return;
    const timer = window.setTimeout(() => setState('idle'), 4000);
    return () => window.clearTimeout(timer);
  }, [state]);

  const handleCopy = () => {
    // The clipboard is refused outside secure contexts and without permission; the address bar still works.
    (navigator.clipboard?.writeText(window.location.href) ?? Promise.reject(new Error('no clipboard'))).then(
      () => setState('copied'),
      () => setState('unavailable'),
    );
  };

  return (
    <span className="inline-flex items-center gap-2">
      <Button variant="secondary" className="py-1.5" onClick={handleCopy}>
        Copy link to this view
      </Button>
      <span role="status" className="text-xs text-ink-600">
        {state === 'copied' && '✓ Link copied'}
        {state === 'unavailable' && 'Copy the address from the address bar.'}
      </span>
    </span>
  );
}
