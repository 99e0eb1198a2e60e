"use client";

/**
 * The handoff board: masters from the porter's bench to digitizing, then revisions from program
 * to release. Each card offers only the moves the viewer's role may make; releasing opens the
 * revision page, where the lead signs with their password.
 */
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { toast } from "sonner";
import type { Role } from "@/db/enums";
import type { BoardCard, BoardStage } from "@/db/queries/handoff";
import { masterMovesFor } from "@/lib/library/stages";
import type { NoticeResult } from "@/lib/programs/notices";
import { revisionMovesFor } from "@/lib/programs/states";
import { MasterMoves } from "../library/MasterMoves";
import { RevisionBadge, StageBadge } from "../library/StageBadge";
import { fetchJson } from "../table/fetch-json";
import { buttonClass } from "../ui/Button";
import { formatDateTime } from "../ui/format";

const COLUMN: Record<BoardStage, { title: string; hint: string }> = {
  hand_porting: { title: "Hand porting", hint: "On the porter's bench" },
  ready_to_digitize: { title: "Ready to digitize", hint: "Waiting for a machinist" },
  digitized: { title: "Digitized", hint: "Scans recorded" },
  programmed: { title: "Programmed", hint: "Draft revisions" },
  proving: { title: "Proving", hint: "First cuts and bench" },
  released: { title: "Released", hint: "Cutting customers' heads" },
};

function RevisionCardMoves({ card, role }: { card: Extract<BoardCard, { type: "revision" }>; role: Role }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const moves = revisionMovesFor(card.state, role);
  const toProving = moves.find((m) => m.to === "proving");
  const release = moves.find((m) => m.to === "released");
  return (
    <div className="flex flex-wrap gap-2">
      {toProving && (
        <button
          className={buttonClass("primary", "min-h-8 px-2 text-xs")}
          disabled={busy}
          onClick={async () => {
            setBusy(true);
            try {
              const r = await fetchJson<{ notice: NoticeResult | null }>(`/api/revisions/${card.id}/moves`, { method: "POST", body: JSON.stringify({ to: "proving" }) });
              toast.success(`${card.programName} ${card.letter} is in proving.`);
              if (r.notice?.warning) toast.warning(r.notice.warning);
              router.refresh();
            } catch (err) {
              toast.error(err instanceof Error ? err.message : "That move did not work.");
            } finally {
              setBusy(false);
            }
          }}
        >
          {toProving.label}
        </button>
      )}
      {release && (
        <Link className={buttonClass("secondary", "min-h-8 px-2 text-xs")} href={`/programs/${card.programId}/revisions/${card.id}#sign`}>
          Release…
        </Link>
      )}
    </div>
  );
}

export function Board({ board, role }: { board: Record<BoardStage, BoardCard[]>; role: Role }) {
  return (
    <div className="grid gap-3 overflow-x-auto pb-2 md:auto-cols-[minmax(14rem,1fr)] md:grid-flow-col" data-testid="handoff-board">
      {(Object.keys(COLUMN) as BoardStage[]).map((stage) => (
        <section key={stage} className="flex min-w-0 flex-col gap-2 rounded-lg border border-rule bg-paper-deep/60 p-2" aria-label={COLUMN[stage].title} data-testid={`column-${stage}`}>
          <header className="px-1">
            <h2 className="text-sm font-bold uppercase tracking-wider text-ink">
              {COLUMN[stage].title} <span className="font-mono text-ink-faint">{board[stage].length}</span>
            </h2>
            <p className="text-xs text-ink-faint">{COLUMN[stage].hint}</p>
          </header>
          {board[stage].length === 0 && <p className="rounded border border-dashed border-rule px-2 py-4 text-center text-xs text-ink-faint">Nothing here.</p>}
          {board[stage].map((card) =>
            card.type === "master" ? (
              <article key={`m${card.id}`} className="flex flex-col gap-2 rounded-md border border-rule bg-card p-2 text-sm" data-testid={`card-master-${card.label}`}>
                <div className="flex flex-wrap items-center justify-between gap-2">
                  <Link href={`/masters/${card.id}`} className="font-mono font-bold text-copper-deep hover:underline">
                    {card.label}
                  </Link>
                  <StageBadge stage={card.stage} />
                </div>
                <p className="text-xs text-ink-soft">
                  Casting <span className="font-mono">{card.castingNumber}</span>
                  {card.who && <> · {card.who}</>}
                </p>
                <p className="text-xs text-ink-faint">{formatDateTime(card.updatedAt)}</p>
                {masterMovesFor(card.stage, role).length > 0 && <MasterMoves masterId={card.id} label={card.label} stage={card.stage} role={role} compact />}
              </article>
            ) : (
              <article key={`r${card.id}`} className="flex flex-col gap-2 rounded-md border border-rule bg-card p-2 text-sm" data-testid={`card-revision-${card.id}`}>
                <div className="flex flex-wrap items-center justify-between gap-2">
                  <Link href={`/programs/${card.programId}/revisions/${card.id}`} className="font-semibold text-copper-deep hover:underline">
                    {card.programName} <span className="font-mono">{card.letter}</span>
                  </Link>
                  <RevisionBadge state={card.state} />
                </div>
                <p className="text-xs text-ink-soft">
                  <span className="font-mono">{card.castingNumber}</span> · {card.port}
                  {card.who && <> · {card.who}</>}
                </p>
                <RevisionCardMoves card={card} role={role} />
              </article>
            ),
          )}
        </section>
      ))}
    </div>
  );
}
