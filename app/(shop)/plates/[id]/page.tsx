import Link from "next/link";
import { notFound } from "next/navigation";
import { Details } from "@/components/library/Details";
import { Gallery } from "@/components/uploads/Gallery";
import { PhotoUploader } from "@/components/uploads/PhotoUploader";
import { buttonClass } from "@/components/ui/Button";
import { Card, PageHeader } from "@/components/ui/Card";
import { formatNumber } from "@/components/ui/format";
import { db } from "@/db/client";
import { getPlate } from "@/db/queries/library";
import { hasRole } from "@/lib/auth/guard";
import { EVERYONE } from "@/lib/auth/roles";
import { PLATE_EDITORS } from "@/lib/library/plates";
import { PHOTO_ROLES } from "@/lib/uploads/service";
import { requirePageRole } from "../../../_server/session";

const n = (v: number | undefined) => (v == null ? "—" : formatNumber(v, 3));

export default async function PlatePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageRole(EVERYONE, `/plates/${id}`);
  const data = getPlate(db(), Number(id));
  if (!data) notFound();
  const { plate, headType, photos } = data;
  const env = plate.envelope;
  return (
    <>
      <PageHeader title={`Plate ${plate.code}`} subtitle={`For casting ${headType.castingNumber}`} actions={hasRole(actor, PLATE_EDITORS) ? <Link href={`/plates/${plate.id}/edit`} className={buttonClass("secondary")}>Edit</Link> : null} />
      <div className="flex flex-col gap-4">
        <Card title="Datum and dowels">
          <p className="whitespace-pre-wrap text-sm">{plate.datumDescription || "—"}</p>
        </Card>
        <div className="grid gap-4 lg:grid-cols-3">
          <Card title="Work offsets">
            <table className="w-full text-sm">
              <thead><tr className="border-b border-rule text-left text-ink-soft"><th>Code</th><th>X</th><th>Y</th><th>Z</th><th>A</th><th>B</th></tr></thead>
              <tbody>
                {Object.entries(plate.workOffsets).map(([code, o]) => (
                  <tr key={code} className="font-mono"><td className="font-semibold">{code}</td><td>{n(o.x)}</td><td>{n(o.y)}</td><td>{n(o.z)}</td><td>{n(o.a)}</td><td>{n(o.b)}</td></tr>
                ))}
              </tbody>
            </table>
          </Card>
          <Card title="Port-axis angles">
            <Details columns={2} items={[["Intake A / B", `${n(plate.portAxisAngles.intake?.a)} / ${n(plate.portAxisAngles.intake?.b)} °`], ["Exhaust A / B", `${n(plate.portAxisAngles.exhaust?.a)} / ${n(plate.portAxisAngles.exhaust?.b)} °`]]} />
          </Card>
          <Card title="Allowed envelope (work, mm)">
            <Details columns={3} items={[["X", `${n(env.min.x)} … ${n(env.max.x)}`], ["Y", `${n(env.min.y)} … ${n(env.max.y)}`], ["Z", `${n(env.min.z)} … ${n(env.max.z)}`]]} />
          </Card>
        </div>
        {plate.notes && <Card title="Notes"><p className="whitespace-pre-wrap text-sm">{plate.notes}</p></Card>}
        <Card title="Photos">
          <div className="flex flex-col gap-4">
            <Gallery photos={photos} removableFrom={hasRole(actor, PHOTO_ROLES.fixture_plate) ? "plate" : undefined} />
            {hasRole(actor, PHOTO_ROLES.fixture_plate) && <PhotoUploader entity="fixture_plate" entityId={plate.id} />}
          </div>
        </Card>
      </div>
    </>
  );
}
