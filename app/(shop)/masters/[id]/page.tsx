import Link from "next/link";
import { notFound } from "next/navigation";
import { Details, mm } from "@/components/library/Details";
import { MasterMoves } from "@/components/library/MasterMoves";
import { StageBadge } from "@/components/library/StageBadge";
import { ThroatReadout } from "@/components/library/ThroatReadout";
import { Gallery } from "@/components/uploads/Gallery";
import { PhotoUploader } from "@/components/uploads/PhotoUploader";
import { buttonClass } from "@/components/ui/Button";
import { Card, EmptyState, PageHeader } from "@/components/ui/Card";
import { formatDate } from "@/components/ui/format";
import { db } from "@/db/client";
import { getMaster } from "@/db/queries/library";
import { hasRole } from "@/lib/auth/guard";
import { EVERYONE, MACHINISTS } from "@/lib/auth/roles";
import { MASTER_EDITORS } from "@/lib/library/masters";
import { PHOTO_ROLES } from "@/lib/uploads/service";
import { requirePageRole } from "../../../_server/session";

export default async function MasterPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageRole(EVERYONE, `/masters/${id}`);
  const data = getMaster(db(), Number(id));
  if (!data) notFound();
  const { master, headType, porterName, scans, photos, flowTestCount } = data;
  const canEdit = hasRole(actor, MASTER_EDITORS) && master.stage !== "retired";
  return (
    <>
      <PageHeader
        title={`Master ${master.label}`}
        subtitle={`Casting ${headType.castingNumber} · ${headType.engineFamily}`}
        actions={
          <>
            {canEdit && <Link href={`/masters/${master.id}/edit`} className={buttonClass("secondary")}>Edit notes and readings</Link>}
            {hasRole(actor, MACHINISTS) && master.stage !== "hand_porting" && master.stage !== "retired" && (
              <Link href={`/scans/new?masterId=${master.id}`} className={buttonClass("primary")}>Record a scan</Link>
            )}
          </>
        }
      />
      <div className="flex flex-col gap-4">
        <Card title="Handoff">
          <div className="flex flex-wrap items-center gap-4">
            <span className="text-sm">Stage:</span> <span data-testid="master-stage"><StageBadge stage={master.stage} /></span>
            <MasterMoves masterId={master.id} label={master.label} stage={master.stage} role={actor.role} />
          </div>
        </Card>
        <Card title="Master head">
          <Details
            columns={4}
            items={[
              ["Head type", <Link key="ht" className="font-mono text-copper-deep hover:underline" href={`/head-types/${headType.id}`}>{headType.castingNumber}</Link>],
              ["Porter", porterName],
              ["Started", formatDate(master.startedOn)],
              ["Handed over", formatDate(master.finishedOn)],
              ["Flow tests", flowTestCount],
            ]}
          />
          {master.notes && <p className="mt-3 whitespace-pre-wrap text-sm">{master.notes}</p>}
        </Card>
        <div className="grid gap-4 lg:grid-cols-2">
          {(["intake", "exhaust"] as const).map((port) => {
            const m = master.measurements[port] ?? {};
            const valve = port === "intake" ? headType.intakeValveMm : headType.exhaustValveMm;
            return (
              <Card key={port} title={port === "intake" ? "Intake port" : "Exhaust port"}>
                <p className="mb-3 whitespace-pre-wrap text-sm">{master.handPortNotes[port] || <span className="text-ink-faint">No hand-port notes.</span>}</p>
                <Details
                  columns={3}
                  items={[
                    ["Throat by caliper", mm(m.throatMm)],
                    ["Seat ID", mm(m.seatIdMm)],
                    ["Port volume", m.portVolumeCc != null ? `${m.portVolumeCc} cc` : null],
                    ["Valve head", mm(valve)],
                    ["Short side", m.shortSideNote],
                  ]}
                />
                <div className="mt-3">
                  <ThroatReadout port={port} throatMm={m.throatMm} valveMm={valve} />
                </div>
              </Card>
            );
          })}
        </div>
        <Card title="Scans">
          {scans.length === 0 ? (
            <EmptyState title="No scan recorded yet." />
          ) : (
            <ul className="flex flex-col gap-1 text-sm">
              {scans.map((s) => (
                <li key={s.id}>
                  <Link className="font-mono text-copper-deep hover:underline" href={`/scans/${s.id}`}>S-{s.id}</Link> · {s.port} · {s.plateCode} · {s.machineName} · {formatDate(s.scannedOn)}
                </li>
              ))}
            </ul>
          )}
        </Card>
        <Card title="Photos">
          <div className="flex flex-col gap-4">
            <Gallery photos={photos} removableFrom={hasRole(actor, PHOTO_ROLES.master_head) ? "master" : undefined} />
            {hasRole(actor, PHOTO_ROLES.master_head) && <PhotoUploader entity="master_head" entityId={master.id} />}
          </div>
        </Card>
      </div>
    </>
  );
}
