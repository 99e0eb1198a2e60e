import Link from "next/link";
import { notFound } from "next/navigation";
import { Details, mm } from "@/components/library/Details";
import { StageBadge } from "@/components/library/StageBadge";
import { buttonClass } from "@/components/ui/Button";
import { Card, EmptyState, PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { getHeadType } from "@/db/queries/head-types";
import { headTypeRelations } from "@/db/queries/library";
import { hasRole } from "@/lib/auth/guard";
import { EVERYONE } from "@/lib/auth/roles";
import { HEAD_TYPE_EDITORS } from "@/lib/library/head-types";
import { requirePageRole } from "../../../_server/session";

export default async function HeadTypePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageRole(EVERYONE, `/head-types/${id}`);
  const ht = getHeadType(db(), Number(id));
  if (!ht) notFound();
  const rel = headTypeRelations(db(), ht.id);
  return (
    <>
      <PageHeader
        title={`Casting ${ht.castingNumber}`}
        subtitle={ht.engineFamily}
        actions={hasRole(actor, HEAD_TYPE_EDITORS) ? <Link href={`/head-types/${ht.id}/edit`} className={buttonClass("secondary")}>Edit</Link> : null}
      />
      <div className="flex flex-col gap-4">
        <Card title="Casting">
          <Details
            columns={4}
            items={[
              ["Cylinders", ht.cylinders],
              ["Valves per cylinder", ht.valvesPerCylinder],
              ["Bore", mm(ht.boreMm)],
              ["Stroke", mm(ht.strokeMm)],
              ["Intake valve", mm(ht.intakeValveMm)],
              ["Exhaust valve", mm(ht.exhaustValveMm)],
              ["Intake seat ID", mm(ht.intakeSeatIdMm)],
              ["Exhaust seat ID", mm(ht.exhaustSeatIdMm)],
            ]}
          />
          {ht.notes && <p className="mt-3 whitespace-pre-wrap text-sm">{ht.notes}</p>}
        </Card>
        <div className="grid gap-4 lg:grid-cols-3">
          <Card title="Fixture plates">
            {rel.plates.length === 0 ? <EmptyState title="No plate for this casting." /> : (
              <ul className="text-sm">{rel.plates.map((p) => <li key={p.id}><Link className="font-mono text-copper-deep hover:underline" href={`/plates/${p.id}`}>{p.code}</Link></li>)}</ul>
            )}
          </Card>
          <Card title="Master heads">
            {rel.masters.length === 0 ? <EmptyState title="No master yet." /> : (
              <ul className="flex flex-col gap-1 text-sm">{rel.masters.map((m) => <li key={m.id} className="flex items-center gap-2"><Link className="font-mono text-copper-deep hover:underline" href={`/masters/${m.id}`}>{m.label}</Link><StageBadge stage={m.stage} /></li>)}</ul>
            )}
          </Card>
          <Card title="Programs">
            {rel.programs.length === 0 ? <EmptyState title="No program yet." /> : (
              <ul className="text-sm">{rel.programs.map((p) => <li key={p.id}><Link className="text-copper-deep hover:underline" href={`/programs/${p.id}`}>{p.name}</Link> <span className="text-ink-faint">({p.port})</span></li>)}</ul>
            )}
          </Card>
        </div>
      </div>
    </>
  );
}
