import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link, Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { roleLabels } from '@shared/auth/permissions';
import { signInInput, type SignInInput } from '@shared/schemas/auth';
import { BrandMark } from '@/components/ui/brand-mark';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { paths } from '@/config/paths';
import { useDemoAccounts } from '@/features/auth/api/get-demo-accounts';
import { useMe } from '@/features/auth/api/get-me';
import { useSignIn } from '@/features/auth/api/sign-in';
import { ApiError } from '@/lib/api-client';

/** Only same-site paths are followed after sign-in, so a crafted link cannot send the user elsewhere. */
function safeNext(next: string | null): string {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : paths.home.href();
}

export default function SignInRoute() {
  const [searchParams] = useSearchParams();
  const next = safeNext(searchParams.get('next'));
  const navigate = useNavigate();
  const me = useMe();
  const signIn = useSignIn();
  const demo = useDemoAccounts();
  const form = useForm<SignInInput>({ resolver: zodResolver(signInInput), defaultValues: { email: '', password: '' } });

  if (me.data) return <Navigate to={next} replace />;

  const handleSubmit = form.handleSubmit((values) => {
    signIn.mutate(values, { onSuccess: () => navigate(next, { replace: true }) });
  });

  const handleUseDemo = (email: string) => {
    form.setValue('email', email, { shouldValidate: true });
    if (demo.data?.password) form.setValue('password', demo.data.password, { shouldValidate: true });
  };

  const failure = signIn.error instanceof ApiError ? signIn.error : null;

  return (
    <div className="grid min-h-screen lg:grid-cols-[2fr_3fr]">
      <section className="flex flex-col justify-between bg-lagoon-900 p-10 text-lagoon-100">
        <div className="flex items-center gap-3 text-2xl font-semibold text-white">
          <BrandMark className="size-9" />
          Kcatalog
        </div>
        <div className="max-w-md space-y-4 py-10">
          <p className="text-3xl font-semibold leading-tight text-white">Every variant, every rate, one honest ranking.</p>
          <p>
            Register enzyme variants, attach kinetic measurements with their uncertainties, compare each variant with a
            condition-matched parent and decide which to carry forward.
          </p>
        </div>
        <p className="text-xs text-lagoon-300">For research use only. Not for clinical or diagnostic decisions.</p>
      </section>
      <section className="flex items-center justify-center p-8">
        <div className="w-full max-w-sm space-y-6">
          <h1 className="text-2xl font-semibold">Sign in</h1>
          {failure && (
            <Notice tone="danger" title={failure.status === 429 ? 'Too many attempts' : 'Sign-in failed'}>
              {failure.message}
            </Notice>
          )}
          <form noValidate onSubmit={handleSubmit} className="space-y-4">
            <TextField label="E-mail address" type="email" autoComplete="username" error={form.formState.errors.email?.message} {...form.register('email')} />
            <TextField label="Password" type="password" autoComplete="current-password" error={form.formState.errors.password?.message} {...form.register('password')} />
            <Button type="submit" variant="primary" className="w-full" busy={signIn.isPending}>
              Sign in
            </Button>
          </form>
          <p className="text-sm">
            <Link to={paths.forgotPassword.href()} className="text-lagoon-700 underline-offset-2 hover:underline">
              Forgot password?
            </Link>
          </p>
          {demo.data && demo.data.accounts.length > 0 && (
            <div className="rounded-lg border border-paper-200 bg-white p-4 text-sm">
              <p className="font-semibold text-ink-700">Demo accounts</p>
              <p className="mt-1 text-ink-500">
                Password <code className="font-mono">{demo.data.password}</code>. Choose one to fill the form.
              </p>
              <ul className="mt-3 divide-y divide-paper-200">
                {demo.data.accounts.map((account) => (
                  <li key={account.email} className="flex items-center justify-between py-1.5">
                    <span className="font-mono text-xs">{account.email}</span>
                    <Button variant="quiet" className="px-2 py-1" onClick={() => handleUseDemo(account.email)} aria-label={`Use the ${roleLabels[account.role]} demo account`}>
                      {roleLabels[account.role]}
                    </Button>
                  </li>
                ))}
              </ul>
            </div>
          )}
        </div>
      </section>
    </div>
  );
}
