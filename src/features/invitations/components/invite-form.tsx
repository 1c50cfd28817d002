import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { roleLabels, roles } from '@shared/auth/permissions';
import { createInvitationInput, invitationLifetimeHours, type CreateInvitationInput } from '@shared/schemas/invitation';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { applyServerErrors } from '@/lib/form-errors';
import { useCreateInvitation } from '../api/create-invitation';

const roleOptions = roles.map((role) => ({ value: role, label: roleLabels[role] }));

/** The admin invites an address with a role; the invitee chooses name and password from the e-mailed link. */
export function InviteForm() {
  const invite = useCreateInvitation();
  const form = useForm<z.input<typeof createInvitationInput>, unknown, CreateInvitationInput>({
    resolver: zodResolver(createInvitationInput),
    defaultValues: { email: '', role: 'viewer' },
  });
  const errors = form.formState.errors;

  const handleSubmit = form.handleSubmit((values) => {
    invite.mutate(values, {
      onSuccess: () => form.reset({ email: '', role: values.role }),
      onError: (error) => applyServerErrors(error, form.setError),
    });
  });

  return (
    <form noValidate onSubmit={handleSubmit} aria-label="Invite someone" className="space-y-4 rounded-lg border border-paper-200 bg-white p-5 shadow-card">
      <h2 className="text-lg font-semibold">Invite someone</h2>
      {invite.isSuccess && (
        <Notice tone="fine" title={`Invitation sent to ${invite.data.email}.`}>
          The link works once, for {invitationLifetimeHours} hours.
        </Notice>
      )}
      {errors.root?.server && <Notice tone="danger" title={errors.root.server.message} />}
      {/* Labels differ from the add-user form beside it, so each field has a name of its own on the page. */}
      <TextField label="Address to invite" type="email" autoComplete="off" error={errors.email?.message} {...form.register('email')} />
      <SelectField label="Role to give" options={roleOptions} error={errors.role?.message} {...form.register('role')} />
      <Button type="submit" variant="primary" busy={invite.isPending}>
        Send invitation
      </Button>
    </form>
  );
}
