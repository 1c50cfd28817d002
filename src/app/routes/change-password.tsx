import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { changePasswordInput, minimumPasswordLength, type ChangePasswordInput } from '@shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { PageHeader } from '@/components/ui/page-header';
import { useChangePassword } from '@/features/auth/api/change-password';
import { applyServerErrors } from '@/lib/form-errors';

export default function ChangePasswordRoute() {
  const changePassword = useChangePassword();
  const form = useForm<ChangePasswordInput>({ resolver: zodResolver(changePasswordInput), defaultValues: { currentPassword: '', newPassword: '' } });

  const handleSubmit = form.handleSubmit((values) => {
    changePassword.mutate(values, {
      onSuccess: () => form.reset(),
      onError: (error) => applyServerErrors(error, form.setError),
    });
  });

  return (
    <div className="max-w-md">
      <PageHeader title="Change password" description="Changing it signs you out everywhere else." />
      {changePassword.isSuccess && <Notice tone="fine" title="Your password was changed." />}
      {form.formState.errors.root?.server && <Notice tone="danger" title={form.formState.errors.root.server.message} />}
      <form noValidate onSubmit={handleSubmit} className="mt-4 space-y-4">
        <TextField label="Current password" type="password" autoComplete="current-password" error={form.formState.errors.currentPassword?.message} {...form.register('currentPassword')} />
        <TextField
          label="New password"
          type="password"
          autoComplete="new-password"
          hint={`At least ${minimumPasswordLength} characters.`}
          error={form.formState.errors.newPassword?.message}
          {...form.register('newPassword')}
        />
        <Button type="submit" variant="primary" busy={changePassword.isPending}>
          Change password
        </Button>
      </form>
    </div>
  );
}
