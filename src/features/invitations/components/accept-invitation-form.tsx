import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { SessionUserDto } from '@shared/schemas/auth';
import { minimumPasswordLength } from '@shared/schemas/auth';
import { acceptInvitationInput, type AcceptInvitationInput } from '@shared/schemas/invitation';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { applyServerErrors } from '@/lib/form-errors';
import { useAcceptInvitation } from '../api/accept-invitation';

/** The invitee chooses a display name and a password; accepting signs them in. */
export function AcceptInvitationForm({ token, onAccepted }: { token: string; onAccepted: (user: SessionUserDto) => void }) {
  const accept = useAcceptInvitation();
  const form = useForm<AcceptInvitationInput>({ resolver: zodResolver(acceptInvitationInput), defaultValues: { token, name: '', password: '' } });
  const errors = form.formState.errors;

  const handleSubmit = form.handleSubmit((values) => {
    accept.mutate(values, { onSuccess: onAccepted, onError: (error) => applyServerErrors(error, form.setError) });
  });

  return (
    <form noValidate onSubmit={handleSubmit} className="space-y-4">
      {(errors.root?.server || errors.token) && <Notice tone="danger" title={errors.root?.server?.message ?? `The link ${errors.token?.message}.`} />}
      <TextField label="Your name" autoComplete="name" hint="As your colleagues will see it." error={errors.name?.message} {...form.register('name')} />
      <TextField
        label="Password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${minimumPasswordLength} characters.`}
        error={errors.password?.message}
        {...form.register('password')}
      />
      <Button type="submit" variant="primary" className="w-full" busy={accept.isPending}>
        Create my account
      </Button>
    </form>
  );
}
