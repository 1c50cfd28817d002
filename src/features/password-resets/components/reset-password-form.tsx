import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { minimumPasswordLength, type SessionUserDto } from '@shared/schemas/auth';
import { completePasswordResetInput, type CompletePasswordResetInput } from '@shared/schemas/password-reset';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { applyServerErrors } from '@/lib/form-errors';
import { useCompletePasswordReset } from '../api/complete-password-reset';

/** Sets the new password from a reset link; every other session of the account ends. */
export function ResetPasswordForm({ token, onDone }: { token: string; onDone: (user: SessionUserDto) => void }) {
  const complete = useCompletePasswordReset();
  const form = useForm<CompletePasswordResetInput>({ resolver: zodResolver(completePasswordResetInput), defaultValues: { token, newPassword: '' } });
  const errors = form.formState.errors;
  const handleSubmit = form.handleSubmit((values) => complete.mutate(values, { onSuccess: onDone, onError: (error) => applyServerErrors(error, form.setError) }));

  return (
    <form noValidate onSubmit={handleSubmit} className="space-y-4">
      {(errors.root?.server || errors.token) && <Notice tone="danger" title={errors.root?.server?.message ?? `The link ${errors.token?.message}.`} />}
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${minimumPasswordLength} characters. Setting it signs you out on every other device.`}
        error={errors.newPassword?.message}
        {...form.register('newPassword')}
      />
      <Button type="submit" variant="primary" className="w-full" busy={complete.isPending}>
        Set the new password
      </Button>
    </form>
  );
}
