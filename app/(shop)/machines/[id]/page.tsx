import Link from "next/link";
import { notFound } from "next/navigation";
import { Details } from "@/components/library/Details";
import { Badge } from "@/components/ui/Badge";
import { buttonClass } from "@/components/ui/Button";
import { Card, PageHeader } from "@/components/ui/Card";
import { formatNumber } from "@/components/ui/format";
import { db } from "@/db/client";
import { getMachine } from "@/db/queries/library";
import { hasRole } from "@/lib/auth/guard";
import { EVERYONE } from "@/lib/auth/roles";
import { MACHINE_EDITORS } from "@/lib/library/machines";
import { requirePageRole } from "../../../_server/session";

export default async function MachinePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageRole(EVERYONE, `/machines/${id}`);
  const m = getMachine(db(), Number(id));
  if (!m) notFound();
  const r = (v: { min: number; max: number } | undefined, unit: string) => (v ? `${formatNumber(v.min, 1)} … ${formatNumber(v.max, 1)} ${unit}` : "continuous");
  return (
    <>
      <PageHeader title={m.name} subtitle={m.description} actions={hasRole(actor, MACHINE_EDITORS) ? <Link href={`/machines/${m.id}/edit`} className={buttonClass("secondary")}>Edit</Link> : null} />
      <div className="flex flex-col gap-4">
        <Card title="Profile">
          <div className="mb-3"><Badge tone={m.active ? "ok" : "neutral"}>{m.active ? "In service" : "Out of service"}</Badge></div>
          <Details
            columns={4}
            items={[
              ["Axes", <span key="a" className="font-mono">{m.axes}</span>],
              ["Maximum feed", `${formatNumber(m.maxFeedMmMin, 0)} mm/min`],
              ["Maximum spindle", `${formatNumber(m.maxSpindleRpm, 0)} rpm`],
              ["Tool change", `${formatNumber(m.toolChangeS, 1)} s`],
              ...(["X", "Y", "Z"] as const).map((a): [string, string] => [`${a} travel`, r(m.limits.travelMm[a], "mm")]),
              ...(["A", "B", "C"] as const).filter((a) => m.axes.includes(a)).map((a): [string, string] => [`${a} limit`, r(m.limits.rotaryDeg[a], "°")]),
              ...(Object.entries(m.limits.rapidPerMin) as Array<[string, number]>).map(([a, v]): [string, string] => [`${a} rapid`, `${formatNumber(v, 0)} ${"XYZ".includes(a) ? "mm/min" : "°/min"}`]),
            ]}
          />
        </Card>
        {m.notes && <Card title="Notes"><p className="whitespace-pre-wrap text-sm">{m.notes}</p></Card>}
      </div>
    </>
  );
}
