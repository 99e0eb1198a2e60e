import Link from "next/link";
import { Card, PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { shopOverview } from "@/db/queries/overview";
import { EVERYONE, ROLE_LABEL } from "@/lib/auth/roles";
import { requirePageRole } from "../_server/session";

export const metadata = { title: "Overview" };

const MASTER_STAGE_WORDS = { hand_porting: "Hand porting", ready_to_digitize: "Ready to digitize", digitized: "Digitized", retired: "Retired" } as const;
const REVISION_WORDS = { draft: "Draft", proving: "Proving", released: "Released", superseded: "Superseded", withdrawn: "Withdrawn" } as const;
const JOB_WORDS = { quoted: "Quoted", scheduled: "Scheduled", on_machine: "On the machine", in_inspection: "In inspection", shipped: "Shipped", cancelled: "Cancelled" } as const;

const ROLE_FOCUS = {
  porter: "Your masters in hand porting, and flow tests waiting to be recorded.",
  machinist: "Masters ready to digitize, programs to prove, and heads to cut.",
  lead: "Revisions waiting for release, and jobs in flight.",
  auditor: "Lineage, the audit trail and recall lists. You can read everything; you change nothing.",
  admin: "Everything a lead sees, plus users, invitations and machines.",
} as const;

function Tally({ title, counts, words }: { title: string; counts: Partial<Record<string, number>>; words: Record<string, string> }) {
  return (
    <Card title={title}>
      <dl className="grid grid-cols-2 gap-x-4 gap-y-2 text-sm">
        {Object.entries(words).map(([key, label]) => (
          <div key={key} className="contents">
            <dt className="text-ink-soft">{label}</dt>
            <dd className="text-right font-mono font-semibold" data-testid={`count-${key}`}>
              {counts[key] ?? 0}
            </dd>
          </div>
        ))}
      </dl>
    </Card>
  );
}

export default async function OverviewPage() {
  const actor = await requirePageRole(EVERYONE, "/");
  const o = shopOverview(db());
  return (
    <>
      <PageHeader title="Overview" subtitle={`${ROLE_LABEL[actor.role]} — ${ROLE_FOCUS[actor.role]}`} />
      <div className="grid gap-4 sm:grid-cols-2 xl:grid-cols-4">
        <Card title="This week">
          <p className="font-mono text-3xl font-bold" data-testid="cuts-this-week">
            {o.cutsThisWeek}
          </p>
          <p className="text-sm text-ink-soft">ports cut, {o.scrapThisWeek} scrapped</p>
        </Card>
        <Card title="Library">
          <dl className="grid grid-cols-2 gap-y-1 text-sm">
            <dt className="text-ink-soft">Head types</dt>
            <dd className="text-right font-mono font-semibold" data-testid="count-head-types">
              <Link href="/head-types" className="underline decoration-copper/50 underline-offset-2">
                {o.headTypes}
              </Link>
            </dd>
            <dt className="text-ink-soft">Machines</dt>
            <dd className="text-right font-mono font-semibold">{o.machines}</dd>
            <dt className="text-ink-soft">Flow tests</dt>
            <dd className="text-right font-mono font-semibold">{o.flowTests}</dd>
            <dt className="text-ink-soft">People</dt>
            <dd className="text-right font-mono font-semibold">{o.users}</dd>
          </dl>
        </Card>
        <Tally title="Masters" counts={o.mastersByStage} words={MASTER_STAGE_WORDS} />
        <Tally title="Program revisions" counts={o.revisionsByState} words={REVISION_WORDS} />
        <Tally title="Jobs" counts={o.jobsByState} words={JOB_WORDS} />
      </div>
    </>
  );
}
