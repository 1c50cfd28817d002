import { useQueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import type { SessionUserDto } from '@shared/schemas/auth';
import { PublicPage } from '@/components/layout/public-page';
import { Notice } from '@/components/ui/notice';
import { LoadingState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { getMeQueryOptions } from '@/features/auth/api/get-me';
import { usePasswordReset } from '@/features/password-resets/api/get-password-reset';
import { ResetPasswordForm } from '@/features/password-resets/components/reset-password-form';

export default function ResetPasswordRoute() {
  const [search] = useSearchParams();
  const token = search.get('token') ?? '';
  const reset = usePasswordReset(token);
  const queryClient = useQueryClient();
  const navigate = useNavigate();

  const handleDone = (user: SessionUserDto) => {
    queryClient.clear();
    queryClient.setQueryData(getMeQueryOptions().queryKey, user);
    navigate(paths.home.href(), { replace: true });
  };

  return (
    <PublicPage title="Set a new password">
      {reset.isPending && <LoadingState label="Checking the link…" />}
      {reset.isError && (
        <>
          <Notice tone="danger" title="This link cannot be used">
            {reset.error.message}
          </Notice>
          <p className="text-sm">
            <Link to={paths.forgotPassword.href()} className="text-lagoon-700 underline">
              Ask for a new link
            </Link>
          </p>
        </>
      )}
      {reset.data && (
        <>
          <p className="text-sm text-ink-700">
            For <span className="font-mono">{reset.data.email}</span>.
          </p>
          <ResetPasswordForm token={token} onDone={handleDone} />
        </>
      )}
    </PublicPage>
  );
}
