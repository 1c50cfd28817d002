import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { useMemo } from 'react';
import { roleLabels, roles, type Role } from '@shared/auth/permissions';
import type { SessionUserDto, UserDto } from '@shared/schemas/auth';
import { Button } from '@/components/ui/button';
import { DataTable } from '@/components/ui/data-table';
import { Notice } from '@/components/ui/notice';
import { ApiError } from '@/lib/api-client';
import { useUpdateUser } from '../api/update-user';

const column = createColumnHelper<UserDto>();

function formatDateTime(iso: string | null): string {
  return iso ? new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' }) : 'never';
}

export function UsersTable({ users, me, onReload }: { users: UserDto[]; me: SessionUserDto; onReload: () => void }) {
  const updateUser = useUpdateUser();

  const columns = useMemo(
    () => [
      column.accessor('name', { header: 'Name', cell: (info) => <span className="font-medium">{info.getValue()}</span> }),
      column.accessor('email', { header: 'E-mail', cell: (info) => <span className="font-mono text-xs">{info.getValue()}</span> }),
      column.accessor('role', {
        header: 'Role',
        cell: (info) => {
          const user = info.row.original;
          return (
            <select
              aria-label={`Role of ${user.name}`}
              value={user.role}
              disabled={user.id === me.id || updateUser.isPending}
              onChange={(event) => updateUser.mutate({ id: user.id, version: user.version, role: event.target.value as Role })}
              className="rounded-md border border-paper-300 bg-white px-2 py-1 text-sm"
            >
              {roles.map((role) => (
                <option key={role} value={role}>
                  {roleLabels[role]}
                </option>
              ))}
            </select>
          );
        },
      }),
      column.accessor('active', {
        header: 'Status',
        cell: (info) => (info.getValue() ? <span>✓ Active</span> : <span className="text-ink-500">✕ Deactivated</span>),
      }),
      column.accessor('lastSignInAt', { header: 'Last sign-in', cell: (info) => <span className="text-ink-600">{formatDateTime(info.getValue())}</span> }),
      column.display({
        id: 'actions',
        header: () => <span className="sr-only">Actions</span>,
        cell: (info) => {
          const user = info.row.original;
          if (user.id === me.id) return <span className="text-xs text-ink-500">you</span>;
          return (
            <Button
              variant={user.active ? 'danger' : 'secondary'}
              className="px-2.5 py-1"
              disabled={updateUser.isPending}
              onClick={() => updateUser.mutate({ id: user.id, version: user.version, active: !user.active })}
            >
              {user.active ? 'Deactivate' : 'Reactivate'}
            </Button>
          );
        },
      }),
    ],
    [me.id, updateUser],
  );

  const table = useReactTable({ data: users, columns, getCoreRowModel: getCoreRowModel() });
  const failure = updateUser.error instanceof ApiError ? updateUser.error : null;

  return (
    <div className="space-y-3">
      {failure && (
        <Notice tone="danger" title={failure.code === 'stale_version' ? 'Someone else changed this user first' : 'The change was refused'}>
          <p>{failure.message}</p>
          {failure.code === 'stale_version' && (
            <Button className="mt-2" onClick={() => { updateUser.reset(); onReload(); }}>
              Reload the list
            </Button>
          )}
        </Notice>
      )}
      <DataTable table={table} caption="Users" cellAlign="middle" />
    </div>
  );
}
