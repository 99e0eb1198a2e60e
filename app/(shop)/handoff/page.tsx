import { Board } from "@/components/handoff/Board";
import { PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { handoffBoard } from "@/db/queries/handoff";
import { kickAnalyses } from "@/lib/analysis/scheduler";
import { EVERYONE } from "@/lib/auth/roles";
import { requirePageRole } from "../../_server/session";

export const metadata = { title: "Handoff" };

export default async function HandoffPage() {
  const actor = await requirePageRole(EVERYONE, "/handoff");
  kickAnalyses(db());
  return (
    <>
      <PageHeader title="Handoff" subtitle="From the porter's bench to a released program: masters by stage, then revisions by state. Moves you may make show on each card." />
      <Board board={handoffBoard(db())} role={actor.role} />
    </>
  );
}
