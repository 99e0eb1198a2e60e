"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { toast } from "sonner";
import { ROLES, ROLE_LABEL, type Role } from "@/lib/auth/roles";
import { DataTable, type Columns } from "../table/DataTable";
import { fetchJson } from "../table/fetch-json";
import { Badge } from "../ui/Badge";
import { Button } from "../ui/Button";
import { inputClass } from "../ui/Field";
import { formatDateTime } from "../ui/format";

type UserRow = { id: number; email: string; name: string; role: Role; active: boolean; lastSignInAt: number | null };

function useUpdateUser() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, change }: { id: number; change: { role?: Role; active?: boolean } }) =>
      fetchJson<UserRow>(`/api/users/${id}`, { method: "PATCH", body: JSON.stringify(change) }),
    onSuccess: (user) => {
      toast.success(`${user.name}: ${ROLE_LABEL[user.role]}, ${user.active ? "active" : "deactivated"}.`);
      qc.invalidateQueries({ queryKey: ["users"] });
    },
    onError: (err: Error) => toast.error(err.message),
  });
}

function RoleCell({ row, disabled }: { row: UserRow; disabled: boolean }) {
  const update = useUpdateUser();
  return (
    <select
      aria-label={`Role of ${row.name}`}
      className={inputClass()}
      value={row.role}
      disabled={disabled || update.isPending}
      onChange={(e) => update.mutate({ id: row.id, change: { role: e.target.value as Role } })}
    >
      {ROLES.map((r) => (
        <option key={r} value={r}>
          {ROLE_LABEL[r]}
        </option>
      ))}
    </select>
  );
}

function ActiveCell({ row, disabled }: { row: UserRow; disabled: boolean }) {
  const update = useUpdateUser();
  return (
    <div className="flex items-center gap-2">
      <Badge tone={row.active ? "ok" : "neutral"}>{row.active ? "Active" : "Deactivated"}</Badge>
      {!disabled && (
        <Button variant={row.active ? "danger" : "secondary"} disabled={update.isPending} onClick={() => update.mutate({ id: row.id, change: { active: !row.active } })}>
          {row.active ? "Deactivate" : "Reactivate"}
        </Button>
      )}
    </div>
  );
}

export function UsersTable({ currentUserId }: { currentUserId: number }) {
  const columns: Columns<UserRow> = [
    { accessorKey: "name", header: "Name", cell: (c) => <span className="font-semibold">{c.getValue() as string}</span> },
    { accessorKey: "email", header: "E-mail" },
    { accessorKey: "role", header: "Role", cell: (c) => <RoleCell row={c.row.original} disabled={c.row.original.id === currentUserId} /> },
    { accessorKey: "active", header: "Account", cell: (c) => <ActiveCell row={c.row.original} disabled={c.row.original.id === currentUserId} /> },
    { accessorKey: "lastSignInAt", header: "Last sign-in", cell: (c) => <span className="whitespace-nowrap">{formatDateTime(c.getValue() as number | null)}</span> },
  ];
  return <DataTable endpoint="/api/users" queryKey="users" columns={columns} searchLabel="Name or e-mail" initialSort={{ id: "name", desc: false }} />;
}
