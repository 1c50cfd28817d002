import { Link } from 'react-router-dom';
import { passwordResetLifetimeMinutes } from '@shared/schemas/password-reset';
import { PublicPage } from '@/components/layout/public-page';
import { paths } from '@/config/paths';
import { ForgotPasswordForm } from '@/features/password-resets/components/forgot-password-form';

export default function ForgotPasswordRoute() {
  return (
    <PublicPage title="Forgot your password?">
      <p className="text-sm text-ink-700">Give the address you sign in with. We send it a link to set a new password; the link works once, for {passwordResetLifetimeMinutes} minutes.</p>
      <ForgotPasswordForm />
      <p className="text-sm">
        <Link to={paths.signIn.href()} className="text-lagoon-700 underline">
          Back to sign-in
        </Link>
      </p>
    </PublicPage>
  );
}
