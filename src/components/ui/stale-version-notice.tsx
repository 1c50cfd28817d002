import { ApiError } from '@/lib/api-client';
import { Button } from './button';
import { Notice } from './notice';

/** Whether an error is the server's refusal of a stale version (someone saved first). */
export const isStaleVersion = (error: unknown): boolean => error instanceof ApiError && error.code === 'stale_version';

/** Explains a 409 stale version and offers to load what is stored now (the change typed is then redone). */
export function StaleVersionNotice({ what, onReload }: { what: string; onReload: () => void }) {
  return (
    <Notice tone="caution" title={`Someone else changed this ${what} first`}>
      <p>Nothing was saved. Reload to see the current version, then make your change again.</p>
      <Button className="mt-2" onClick={onReload}>
        Reload the {what}
      </Button>
    </Notice>
  );
}
