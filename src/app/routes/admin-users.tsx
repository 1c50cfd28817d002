import { PageHeader } from '@/components/ui/page-header';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { useMe } from '@/features/auth/api/get-me';
import { InvitationsList } from '@/features/invitations/components/invitations-list';
import { InviteForm } from '@/features/invitations/components/invite-form';
import { useUsers } from '@/features/users/api/get-users';
import { CreateUserForm } from '@/features/users/components/create-user-form';
import { UsersTable } from '@/features/users/components/users-table';

export default function AdminUsersRoute() {
  const me = useMe();
  const users = useUsers();

  return (
    <div>
      <PageHeader title="Users and roles" description="Who can sign in, and what their role lets them do. A deactivated user is signed out at once." />
      <div className="grid gap-6 lg:grid-cols-[1fr_20rem]">
        <section aria-label="Users">
          {users.isPending && <LoadingState label="Loading users…" />}
          {users.isError && <ErrorState error={users.error} onRetry={() => void users.refetch()} />}
          {users.data && users.data.length === 0 && <EmptyState title="No users yet." />}
          {users.data && users.data.length > 0 && me.data && <UsersTable users={users.data} me={me.data} onReload={() => void users.refetch()} />}
        </section>
        <div className="space-y-6">
          <InviteForm />
          <InvitationsList />
          <CreateUserForm />
        </div>
      </div>
    </div>
  );
}
