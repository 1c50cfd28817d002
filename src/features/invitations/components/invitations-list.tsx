import { roleLabels } from '@shared/auth/permissions';
import type { InvitationDto } from '@shared/schemas/invitation';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { ApiError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/format';
import { useInvitations } from '../api/get-invitations';
import { useRevokeInvitation } from '../api/revoke-invitation';

const statusText: Record<InvitationDto['status'], string> = {
  pending: '◷ Waiting',
  accepted: '✓ Accepted',
  expired: '✕ Expired',
  revoked: '✕ Withdrawn',
};

/** Invitations still waiting, and the last few that were answered or lapsed. */
export function InvitationsList() {
  const invitations = useInvitations();
  const revoke = useRevokeInvitation();
  if (invitations.isPending) return <LoadingState label="Loading invitations…" />;
  if (invitations.isError) return <ErrorState error={invitations.error} onRetry={() => void invitations.refetch()} />;
  const pending = invitations.data.filter((invitation) => invitation.status === 'pending');
  const recent = invitations.data.filter((invitation) => invitation.status !== 'pending').slice(0, 5);
  if (pending.length === 0 && recent.length === 0) return null;
  const failure = revoke.error instanceof ApiError ? revoke.error : null;

  return (
    <section aria-label="Invitations" className="space-y-2 rounded-lg border border-paper-200 bg-white p-5 shadow-card">
      <h2 className="text-lg font-semibold">Invitations</h2>
      {failure && <Notice tone="danger" title="The invitation was not withdrawn">{failure.message}</Notice>}
      <ul className="divide-y divide-paper-200 text-sm">
        {[...pending, ...recent].map((invitation) => (
          <li key={invitation.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
            <span>
              <span className="font-mono text-xs">{invitation.email}</span>{' '}
              <span className="text-ink-500">
                as {roleLabels[invitation.role]} · {statusText[invitation.status]}
                {invitation.status === 'pending' ? `, until ${formatDateTime(invitation.expiresAt)}` : ''}
              </span>
            </span>
            {invitation.status === 'pending' && (
              <Button variant="quiet" className="px-2 py-1" disabled={revoke.isPending} onClick={() => revoke.mutate({ id: invitation.id, version: invitation.version })}>
                Withdraw
              </Button>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}
