"use client";

/**
 * The moves a person may make on a revision, offered by role (the server checks again): send to
 * proving, back to draft, withdraw with a reason, and release — signed by re-entering one's
 * password, with a linked flow test or a written override.
 */
import { useRouter } from "next/navigation";
import { useState } from "react";
import { toast } from "sonner";
import type { RevisionState, Role } from "@/db/enums";
import type { NoticeResult } from "@/lib/programs/notices";
import { revisionMovesFor } from "@/lib/programs/states";
import { ApiError, fetchJson } from "../table/fetch-json";
import { Button } from "../ui/Button";
import { Caution } from "../ui/Card";
import { Field, inputClass } from "../ui/Field";

function noticeToast(notice: NoticeResult | null | undefined) {
  if (notice?.warning) toast.warning(notice.warning);
}

export function RevisionActions({ revisionId, letter, state, role, flowTestCount }: { revisionId: number; letter: string; state: RevisionState; role: Role; flowTestCount: number }) {
  const router = useRouter();
  const moves = revisionMovesFor(state, role);
  const [open, setOpen] = useState<null | "released" | "withdrawn" | "draft">(null);
  const [note, setNote] = useState("");
  const [password, setPassword] = useState("");
  const [override, setOverride] = useState("");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [busy, setBusy] = useState(false);

  if (moves.length === 0) return <p className="text-sm text-ink-soft">No moves for your role in this state.</p>;

  async function send(url: string, body: unknown, done: string) {
    setBusy(true);
    setErrors({});
    try {
      const r = await fetchJson<{ notice?: NoticeResult | null }>(url, { method: "POST", body: JSON.stringify(body) });
      toast.success(done);
      noticeToast(r.notice);
      setOpen(null);
      setPassword("");
      router.refresh();
    } catch (err) {
      if (err instanceof ApiError && err.fields) setErrors(Object.fromEntries(Object.entries(err.fields).map(([k, v]) => [k, v[0]])));
      toast.error(err instanceof Error ? err.message : "That did not work.");
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="flex flex-col gap-3" data-testid="revision-actions">
      <div className="flex flex-wrap gap-2">
        {moves.map((m) =>
          m.to === "proving" ? (
            <Button key={m.to} variant="primary" disabled={busy} onClick={() => send(`/api/revisions/${revisionId}/moves`, { to: "proving" }, `Revision ${letter} is in proving.`)}>
              {m.label}
            </Button>
          ) : (
            <Button key={m.to} variant={m.to === "released" ? "primary" : m.to === "withdrawn" ? "danger" : "secondary"} onClick={() => setOpen(m.to as "released" | "withdrawn" | "draft")}>
              {m.label}…
            </Button>
          ),
        )}
      </div>
      {open === "released" && (
        <form
          className="flex max-w-xl flex-col gap-3 rounded-lg border border-copper/40 bg-copper-wash/40 p-4"
          aria-label="Release and sign"
          onSubmit={(e) => {
            e.preventDefault();
            send(`/api/revisions/${revisionId}/release`, { password, overrideReason: override.trim() || undefined }, `Revision ${letter} released.`);
          }}
        >
          <p className="text-sm">
            Releasing makes revision <strong>{letter}</strong> the one jobs cut with, supersedes the program&apos;s current release, and freezes its files and analysis. Your password signs it.
          </p>
          <p className="text-sm">{flowTestCount > 0 ? `${flowTestCount} flow test${flowTestCount === 1 ? " is" : "s are"} linked to this revision.` : "No flow test is linked to this revision: write why it may be released without one."}</p>
          {flowTestCount === 0 && (
            <Field label="Reason to release without a flow test" htmlFor="release-override" error={errors.overrideReason}>
              <textarea id="release-override" rows={2} className={`${inputClass(!!errors.overrideReason)} py-2`} value={override} onChange={(e) => setOverride(e.target.value)} />
            </Field>
          )}
          <Field label="Your password" htmlFor="release-password" error={errors.password}>
            <input id="release-password" type="password" autoComplete="current-password" className={inputClass(!!errors.password)} value={password} onChange={(e) => setPassword(e.target.value)} />
          </Field>
          <Caution title="Before production">
            <p>Do the first-article check of every new revision: measure the cut port and check wall thickness near the water jackets and the seats.</p>
            <p>Keep the machine&apos;s guards closed and wear eye protection. Figures here are estimates; the bench and the inspection decide. Follow the machine builder&apos;s instructions and local codes.</p>
          </Caution>
          <div className="flex gap-2">
            <Button type="submit" variant="primary" disabled={busy || !password}>
              {busy ? "Signing…" : "Sign and release"}
            </Button>
            <Button onClick={() => setOpen(null)}>Not now</Button>
          </div>
        </form>
      )}
      {(open === "withdrawn" || open === "draft") && (
        <form
          className="flex max-w-xl flex-col gap-3 rounded-lg border border-rule bg-card p-4"
          aria-label={open === "withdrawn" ? "Withdraw" : "Back to draft"}
          onSubmit={(e) => {
            e.preventDefault();
            send(`/api/revisions/${revisionId}/moves`, { to: open, note }, open === "withdrawn" ? `Revision ${letter} withdrawn.` : `Revision ${letter} is a draft again.`);
          }}
        >
          <Field label={open === "withdrawn" ? "Why is it withdrawn?" : "Why back to draft?"} htmlFor="move-note" error={errors.note}>
            <textarea id="move-note" rows={2} className={`${inputClass(!!errors.note)} py-2`} value={note} onChange={(e) => setNote(e.target.value)} />
          </Field>
          <div className="flex gap-2">
            <Button type="submit" variant={open === "withdrawn" ? "danger" : "primary"} disabled={busy}>
              {open === "withdrawn" ? "Withdraw revision" : "Back to draft"}
            </Button>
            <Button onClick={() => setOpen(null)}>Not now</Button>
          </div>
        </form>
      )}
    </div>
  );
}
