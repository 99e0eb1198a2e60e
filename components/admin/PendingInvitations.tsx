"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { toast } from "sonner";
import { ROLE_LABEL, type Role } from "@/lib/auth/roles";
import { fetchJson } from "../table/fetch-json";
import { Button } from "../ui/Button";
import { formatDateTime } from "../ui/format";

type Invitation = { id: number; email: string; role: Role; expiresAt: number };

export function PendingInvitations() {
  const qc = useQueryClient();
  const list = useQuery({ queryKey: ["invitations"], queryFn: () => fetchJson<{ rows: Invitation[] }>("/api/invitations") });
  const revoke = useMutation({
    mutationFn: (id: number) => fetchJson(`/api/invitations/${id}`, { method: "DELETE" }),
    onSuccess: () => {
      toast.success("Invitation withdrawn.");
      qc.invalidateQueries({ queryKey: ["invitations"] });
    },
    onError: (err: Error) => toast.error(err.message),
  });
  if (list.isPending) return <p className="text-sm text-ink-faint">Loading…</p>;
  if (list.isError) return <p className="text-sm text-bad">{list.error.message}</p>;
  if (list.data.rows.length === 0) return <p className="text-sm text-ink-soft">No open invitations.</p>;
  return (
    <ul className="flex flex-col divide-y divide-rule text-sm">
      {list.data.rows.map((inv) => (
        <li key={inv.id} className="flex items-center justify-between gap-2 py-2">
          <div className="min-w-0">
            <p className="font-semibold break-all">{inv.email}</p>
            <p className="text-ink-soft">
              {ROLE_LABEL[inv.role]} · expires {formatDateTime(inv.expiresAt)}
            </p>
          </div>
          <Button variant="quiet" onClick={() => revoke.mutate(inv.id)} disabled={revoke.isPending}>
            Withdraw
          </Button>
        </li>
      ))}
    </ul>
  );
}
