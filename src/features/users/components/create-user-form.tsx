import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { roleLabels, roles } from '@shared/auth/permissions';
import { createUserInput, minimumPasswordLength, type CreateUserInput } from '@shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { Notice } from '@/components/ui/notice';
import { applyServerErrors } from '@/lib/form-errors';
import { useCreateUser } from '../api/create-user';

const roleOptions = roles.map((role) => ({ value: role, label: roleLabels[role] }));

export function CreateUserForm() {
  const createUser = useCreateUser();
  const form = useForm<z.input<typeof createUserInput>, unknown, CreateUserInput>({
    resolver: zodResolver(createUserInput),
    defaultValues: { email: '', name: '', role: 'viewer', password: '' },
  });
  const errors = form.formState.errors;

  const handleSubmit = form.handleSubmit((values) => {
    createUser.mutate(values, {
      onSuccess: () => form.reset(),
      onError: (error) => applyServerErrors(error, form.setError),
    });
  });

  return (
    <form noValidate onSubmit={handleSubmit} className="space-y-4 rounded-lg border border-paper-200 bg-white p-5 shadow-card">
      <h2 className="text-lg font-semibold">Add a user</h2>
      {createUser.isSuccess && <Notice tone="fine" title={`${createUser.data.name} can now sign in.`} />}
      {errors.root?.server && <Notice tone="danger" title={errors.root.server.message} />}
      <TextField label="Name" autoComplete="off" error={errors.name?.message} {...form.register('name')} />
      <TextField label="E-mail address" type="email" autoComplete="off" error={errors.email?.message} {...form.register('email')} />
      <SelectField label="Role" options={roleOptions} error={errors.role?.message} {...form.register('role')} />
      <TextField
        label="Initial password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${minimumPasswordLength} characters; they can change it after signing in.`}
        error={errors.password?.message}
        {...form.register('password')}
      />
      <Button type="submit" variant="primary" busy={createUser.isPending}>
        Add user
      </Button>
    </form>
  );
}
