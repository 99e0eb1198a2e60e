"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { toast } from "sonner";
import type { Port, RevisionState } from "@/db/enums";
import { PORT_LABEL, REVISION_STATE_LABEL } from "@/lib/jobs/words";
import { duration } from "@/lib/toolpath/summary";
import { ApiError, fetchJson } from "../table/fetch-json";
import { Button } from "../ui/Button";
import { Field, inputClass } from "../ui/Field";
import { RevisionFlag, RevisionStateBadge, ShortHash } from "./badges";

export type PortView = {
  port: Port;
  cut: boolean;
  flagged: boolean;
  revision: { id: number; label: string; state: RevisionState; sha256: string | null; cycleTimeS: number | null; endReason: string | null } | null;
  choices: Array<{ id: number; label: string; state: RevisionState }>;
};

function PortChoice({ jobId, view, canChoose }: { jobId: number; view: PortView; canChoose: boolean }) {
  const router = useRouter();
  const released = view.choices.filter((c) => c.state === "released");
  const [picked, setPicked] = useState<string>(view.revision?.id ? String(view.revision.id) : (released[0]?.id.toString() ?? ""));
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const selectId = `job-${jobId}-${view.port}-revision`;

  async function save(revisionId: number | null) {
    setBusy(true);
    setError(null);
    try {
      await fetchJson(`/api/jobs/${jobId}/revision`, { method: "PUT", body: JSON.stringify({ port: view.port, revisionId }) });
      toast.success(revisionId ? `${PORT_LABEL[view.port]} revision chosen.` : `${PORT_LABEL[view.port]} revision cleared.`);
      router.refresh();
    } catch (err) {
      const msg = err instanceof ApiError ? (err.fields?.revisionId?.[0] ?? err.message) : "The revision could not be chosen.";
      setError(msg);
      toast.error(msg);
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="flex flex-col gap-2 rounded-md border border-rule p-3" data-testid={`port-${view.port}`}>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h3 className="font-semibold">{PORT_LABEL[view.port]} ports</h3>
        {view.flagged && <RevisionFlag title={`Revision ${view.revision?.state}`} />}
      </div>
      {!view.cut ? (
        <p className="text-sm text-ink-faint">Not cut on this job.</p>
      ) : (
        <>
          {view.revision ? (
            <dl className="grid grid-cols-[8rem_1fr] gap-y-1 text-sm">
              <dt className="text-ink-soft">Revision</dt>
              <dd className="flex flex-wrap items-center gap-2">
                <span className="font-semibold" data-testid={`chosen-${view.port}`}>
                  {view.revision.label}
                </span>
                <RevisionStateBadge state={view.revision.state} />
              </dd>
              {view.revision.endReason && view.revision.state !== "released" && (
                <>
                  <dt className="text-ink-soft">Why it ended</dt>
                  <dd>{view.revision.endReason}</dd>
                </>
              )}
              <dt className="text-ink-soft">Toolpath SHA-256</dt>
              <dd>
                <ShortHash value={view.revision.sha256} />
              </dd>
              <dt className="text-ink-soft">Cycle time</dt>
              <dd>{view.revision.cycleTimeS != null ? `${duration(view.revision.cycleTimeS)} per port` : <span className="text-warn">not yet analysed</span>}</dd>
            </dl>
          ) : (
            <p className="text-sm text-warn">No revision chosen yet.</p>
          )}
          {canChoose && (
            <div className="flex flex-col gap-2">
              <Field label={`Revision for the ${PORT_LABEL[view.port].toLowerCase()} port`} htmlFor={selectId} error={error ?? undefined}>
                <select id={selectId} className={`${inputClass(!!error)} w-full min-w-0`} value={picked} onChange={(e) => setPicked(e.target.value)}>
                  <option value="">Choose…</option>
                  {view.choices.map((c) => (
                    <option key={c.id} value={c.id}>
                      {c.label} — {REVISION_STATE_LABEL[c.state].toLowerCase()}
                    </option>
                  ))}
                </select>
              </Field>
              <div className="flex flex-wrap gap-2">
                <Button variant="primary" disabled={busy || !picked || Number(picked) === view.revision?.id} onClick={() => save(Number(picked))}>
                  Use this revision
                </Button>
                {view.revision && (
                  <Button variant="quiet" disabled={busy} onClick={() => save(null)}>
                    Clear
                  </Button>
                )}
              </div>
            </div>
          )}
          {canChoose && view.choices.length === 0 && <p className="text-sm text-ink-faint">This casting has no {view.port} program yet.</p>}
        </>
      )}
    </div>
  );
}

export function JobPorts({ jobId, ports, canChoose }: { jobId: number; ports: PortView[]; canChoose: boolean }) {
  return (
    <div className="grid gap-3 md:grid-cols-2">
      {ports.map((p) => (
        <PortChoice key={p.port} jobId={jobId} view={p} canChoose={canChoose} />
      ))}
    </div>
  );
}
