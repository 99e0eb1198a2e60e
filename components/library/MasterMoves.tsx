"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { toast } from "sonner";
import type { MasterStage, Role } from "@/db/enums";
import { masterMovesFor } from "@/lib/library/stages";
import type { NoticeResult } from "@/lib/programs/notices";
import { fetchJson } from "../table/fetch-json";
import { Button } from "../ui/Button";

/** The stage moves this person may make on a master (the server checks the same table). */
export function MasterMoves({ masterId, label, stage, role, compact = false }: { masterId: number; label: string; stage: MasterStage; role: Role; compact?: boolean }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const moves = masterMovesFor(stage, role);
  if (moves.length === 0) return compact ? null : <p className="text-sm text-ink-soft">No stage moves for your role.</p>;
  return (
    <div className="flex flex-wrap gap-2">
      {moves.map((m) => (
        <Button
          key={m.to}
          variant={m.to === "retired" ? "danger" : "primary"}
          className={compact ? "min-h-8 px-2 text-xs" : undefined}
          disabled={busy}
          onClick={async () => {
            setBusy(true);
            try {
              const r = await fetchJson<{ notice: NoticeResult | null }>(`/api/masters/${masterId}/moves`, { method: "POST", body: JSON.stringify({ to: m.to }) });
              toast.success(`${label}: ${m.label.toLowerCase()} — done.`);
              if (r.notice?.warning) toast.warning(r.notice.warning);
              else if (r.notice?.sent) toast.message(`E-mailed ${r.notice.recipients.length} ${r.notice.recipients.length === 1 ? "person" : "people"}.`);
              router.refresh();
            } catch (err) {
              toast.error(err instanceof Error ? err.message : "That move did not work.");
            } finally {
              setBusy(false);
            }
          }}
        >
          {m.label}
        </Button>
      ))}
    </div>
  );
}
