"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { toast } from "sonner";
import type { JobState } from "@/db/enums";
import { JOB_STATE_LABEL } from "@/lib/jobs/words";
import { fetchJson } from "../table/fetch-json";
import { Button } from "../ui/Button";

export type MoveView = { to: JobState; allowed: boolean; reasons: string[] };

/** The way forward is the copper button; steps back are plain; cancelling is marked as danger. */
const FORWARD: Record<JobState, number> = { quoted: 0, scheduled: 1, on_machine: 2, in_inspection: 3, shipped: 4, cancelled: 5 };

const VERB: Record<JobState, string> = {
  quoted: "Back to quoting",
  scheduled: "Schedule",
  on_machine: "Put on the machine",
  in_inspection: "Send to inspection",
  shipped: "Mark shipped",
  cancelled: "Cancel the job",
};

export function JobMoves({ jobId, state, moves }: { jobId: number; state: JobState; moves: MoveView[] }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  if (moves.length === 0) return <p className="text-sm text-ink-soft">This job is closed; it moves no further.</p>;

  async function go(to: JobState) {
    if (to === "cancelled" && !window.confirm("Cancel this job? It cannot be reopened.")) return;
    setBusy(true);
    try {
      const res = await fetchJson<{ notice: { sent: boolean; message?: string; to: string[] } | null }>(`/api/jobs/${jobId}/state`, { method: "POST", body: JSON.stringify({ to }) });
      toast.success(`Job moved to ${JOB_STATE_LABEL[to].toLowerCase()}.`);
      if (res.notice?.sent) toast.success(`Shipping notice sent to ${res.notice.to.join(", ")}.`);
      else if (res.notice) toast.warning(res.notice.message ?? "The shipping notice was not sent.");
      router.refresh();
    } catch (err) {
      toast.error(err instanceof Error ? err.message : "The job could not be moved.");
    } finally {
      setBusy(false);
    }
  }

  return (
    <ul className="flex flex-col gap-2">
      {moves.map((m) => (
        <li key={m.to} className="flex flex-wrap items-start gap-3">
          <Button
            variant={m.to === "cancelled" ? "danger" : FORWARD[m.to] > FORWARD[state] && m.allowed ? "primary" : "secondary"}
            disabled={busy || !m.allowed}
            onClick={() => go(m.to)}
          >
            {VERB[m.to]}
          </Button>
          {!m.allowed && (
            <ul className="text-sm text-ink-soft" aria-label={`Why "${VERB[m.to]}" is not open`}>
              {m.reasons.map((r) => (
                <li key={r}>{r}</li>
              ))}
            </ul>
          )}
        </li>
      ))}
    </ul>
  );
}
