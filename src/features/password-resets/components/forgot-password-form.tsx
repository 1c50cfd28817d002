import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { requestPasswordResetInput, type RequestPasswordResetInput } from '@shared/schemas/password-reset';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';
import { applyServerErrors } from '@/lib/form-errors';
import { useRequestPasswordReset } from '../api/request-password-reset';

/** Asks for a reset link; the answer is the same whether or not the address has an account. */
export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const form = useForm<z.input<typeof requestPasswordResetInput>, unknown, RequestPasswordResetInput>({
    resolver: zodResolver(requestPasswordResetInput),
    defaultValues: { email: '' },
  });
  const errors = form.formState.errors;
  const handleSubmit = form.handleSubmit((values) => request.mutate(values, { onError: (error) => applyServerErrors(error, form.setError) }));

  if (request.isSuccess) return <Notice tone="fine" title="Check your inbox">{request.data.message}</Notice>;
  const limited = request.error instanceof ApiError && request.error.status === 429;
  return (
    <form noValidate onSubmit={handleSubmit} className="space-y-4">
      {errors.root?.server && <Notice tone="danger" title={limited ? 'Too many requests' : 'The request failed'}>{errors.root.server.message}</Notice>}
      <TextField label="E-mail address" type="email" autoComplete="username" error={errors.email?.message} {...form.register('email')} />
      <Button type="submit" variant="primary" className="w-full" busy={request.isPending}>
        Send me a link
      </Button>
    </form>
  );
}
