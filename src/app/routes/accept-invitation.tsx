import { useQueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { roleLabels } from '@shared/auth/permissions';
import type { SessionUserDto } from '@shared/schemas/auth';
import { PublicPage } from '@/components/layout/public-page';
import { Notice } from '@/components/ui/notice';
import { LoadingState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { getMeQueryOptions } from '@/features/auth/api/get-me';
import { useInvitation } from '@/features/invitations/api/get-invitation';
import { AcceptInvitationForm } from '@/features/invitations/components/accept-invitation-form';
import { formatDateTime } from '@/lib/format';

export default function AcceptInvitationRoute() {
  const [search] = useSearchParams();
  const token = search.get('token') ?? '';
  const invitation = useInvitation(token);
  const queryClient = useQueryClient();
  const navigate = useNavigate();

  const handleAccepted = (user: SessionUserDto) => {
    // A new person is signed in on this tab: nothing cached before may show.
    queryClient.clear();
    queryClient.setQueryData(getMeQueryOptions().queryKey, user);
    navigate(paths.home.href(), { replace: true });
  };

  return (
    <PublicPage title="Join Kcatalog">
      {invitation.isPending && <LoadingState label="Checking your invitation…" />}
      {invitation.isError && (
        <>
          <Notice tone="danger" title="This invitation cannot be used">
            {invitation.error.message}
          </Notice>
          <p className="text-sm">
            <Link to={paths.signIn.href()} className="text-lagoon-700 underline">
              Go to sign-in
            </Link>
          </p>
        </>
      )}
      {invitation.data && (
        <>
          <p className="text-sm text-ink-700">
            {invitation.data.invitedBy ?? 'An admin'} invited <span className="font-mono">{invitation.data.email}</span> as <strong>{roleLabels[invitation.data.role]}</strong>. Choose your name and a
            password; the link works until {formatDateTime(invitation.data.expiresAt)}.
          </p>
          <AcceptInvitationForm token={token} onAccepted={handleAccepted} />
        </>
      )}
    </PublicPage>
  );
}
