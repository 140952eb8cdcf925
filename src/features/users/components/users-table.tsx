import type { ColDef } from 'ag-grid-community';
import type { CustomCellRendererProps } from 'ag-grid-react';
import { useMemo } from 'react';
import { Button } from '../../../components/button';
import { actionsColumnType, DataGrid } from '../../../components/data-grid';
import { StatusChip } from '../../../components/status-chip';
import { formatDate, isoTimestamp } from '../../../lib/format';
import { roleTitles } from '../../../lib/roles';
import type { UserView } from '../../../../shared/users/views';

export interface UserRowActions {
  onChangeRole: (user: UserView) => void;
  onToggleDisabled: (user: UserView) => void;
  onResetPassword: (user: UserView) => void;
  onClearSecondStep: (user: UserView) => void;
  /** The row whose disable/enable is in flight. */
  busyUserId?: string;
}

const statusWord = (user: UserView) => (user.disabled ? 'Disabled' : 'Active');

export function UsersTable({ users, currentUserId, actions }: { users: UserView[] | undefined; currentUserId: string; actions: UserRowActions }) {
  const columns = useMemo<ColDef<UserView>[]>(
    () => [
      {
        headerName: 'Name',
        field: 'name',
        minWidth: 140,
        cellRenderer: (p: CustomCellRendererProps<UserView, string>) =>
          p.data ? (
            <span>
              {p.data.name}
              {p.data.id === currentUserId ? <span className="ml-1 text-sm text-ink-500">(you)</span> : null}
            </span>
          ) : null,
      },
      {
        headerName: 'E-mail',
        field: 'email',
        minWidth: 190,
        cellClass: 'font-mono text-[0.85rem]',
      },
      {
        headerName: 'Role',
        colId: 'role',
        minWidth: 120,
        valueGetter: (p) => (p.data ? roleTitles[p.data.role] : ''),
      },
      {
        headerName: 'Status',
        colId: 'status',
        minWidth: 110,
        maxWidth: 140,
        valueGetter: (p) => (p.data ? statusWord(p.data) : ''),
        cellRenderer: (p: CustomCellRendererProps<UserView>) =>
          p.data ? <StatusChip tone={p.data.disabled ? 'paused' : 'ok'} label={statusWord(p.data)} /> : null,
      },
      {
        headerName: 'Second step',
        colId: 'secondStep',
        minWidth: 110,
        maxWidth: 140,
        valueGetter: (p) => (p.data ? (p.data.secondStepOn ? 'On' : 'Off') : ''),
        cellRenderer: (p: CustomCellRendererProps<UserView>) =>
          p.data ? <StatusChip tone={p.data.secondStepOn ? 'ok' : 'none'} label={p.data.secondStepOn ? 'On' : 'Off'} /> : null,
      },
      {
        headerName: 'Added',
        colId: 'createdAt',
        field: 'createdAt',
        minWidth: 110,
        maxWidth: 150,
        valueFormatter: (p) => formatDate(p.value as string),
        // CSV gets the exact timestamp, the screen a readable date.
        useValueFormatterForExport: false,
        comparator: (a: string, b: string) => isoTimestamp(a).localeCompare(isoTimestamp(b)),
      },
      {
        headerName: 'Actions',
        colId: 'actions',
        type: actionsColumnType,
        minWidth: 480,
        flex: 2,
        cellRenderer: (p: CustomCellRendererProps<UserView>) => {
          const user = p.data;
          if (!user) return null;
          if (user.id === currentUserId) {
            return <span className="text-sm text-ink-500">Your own password and second step are under “My account”.</span>;
          }
          return (
            <div className="flex h-full flex-nowrap items-center gap-1.5">
              <Button size="sm" onClick={() => actions.onChangeRole(user)}>
                Change role
              </Button>
              <Button
                size="sm"
                variant={user.disabled ? 'secondary' : 'danger'}
                busy={actions.busyUserId === user.id}
                onClick={() => actions.onToggleDisabled(user)}
              >
                {user.disabled ? 'Enable' : 'Disable'}
              </Button>
              <Button size="sm" onClick={() => actions.onResetPassword(user)}>
                Reset password
              </Button>
              {user.secondStepOn ? (
                <Button size="sm" onClick={() => actions.onClearSecondStep(user)}>
                  Clear second step
                </Button>
              ) : null}
            </div>
          );
        },
      },
    ],
    [currentUserId, actions],
  );

  return (
    <DataGrid<UserView> label="Users" rows={users} columns={columns} rowId={(u) => u.id} exportFileName="nestkeeper-users.csv" emptyMessage="No users yet." />
  );
}
