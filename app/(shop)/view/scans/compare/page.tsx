import Link from "next/link";
import { buttonClass } from "@/components/ui/Button";
import { EmptyState, PageHeader } from "@/components/ui/Card";
import { CloudCompareView } from "@/components/viewer/CloudView";
import type { GeometryResultLite, ScanSide } from "@/components/viewer/types";
import { ViewerCaution } from "@/components/viewer/ViewerCaution";
import { db } from "@/db/client";
import { EVERYONE } from "@/lib/auth/roles";
import { requirePageRole } from "../../../../_server/session";
import { pickAnalysed, scanView } from "../../_data/reads";

export const metadata = { title: "Two scans compared" };

type Search = Promise<Record<string, string | string[] | undefined>>;

type Side = { ok: true; side: ScanSide; port: string } | { ok: false; problem: string };

function side(id: number): Side {
  const view = Number.isInteger(id) && id > 0 ? scanView(db(), id) : null;
  if (!view) return { ok: false, problem: `There is no scan S-${Number.isFinite(id) ? id : "?"}.` };
  const file = pickAnalysed(view.clouds);
  const a = file?.analysis;
  const label = `S-${view.data.scan.id} ${view.data.master.label} ${view.data.scan.port}`;
  if (!a || a.state !== "done" || !a.previewFileId) return { ok: false, problem: `Scan ${label} has no finished point-cloud analysis yet.` };
  return { ok: true, side: { analysisId: a.id, result: a.result as GeometryResultLite, label }, port: view.data.scan.port };
}

export default async function CompareScansPage({ searchParams }: { searchParams: Search }) {
  const sp = await searchParams;
  await requirePageRole(EVERYONE, "/view/scans/compare");
  const a = side(Number(sp.a));
  const b = side(Number(sp.b));
  const problems = [a, b].flatMap((s) => (s.ok ? [] : [s.problem]));
  return (
    <>
      <PageHeader
        title="Two scans compared"
        subtitle="Scan B coloured by its distance from scan A, both in the fixture plate's frame; section profiles and their difference below."
        actions={
          <Link href="/view" className={buttonClass("quiet")}>
            All 3D views
          </Link>
        }
      />
      <div className="flex flex-col gap-4">
        {a.ok && b.ok ? (
          <>
            {a.port !== b.port && <p className="rounded-md border border-warn/40 bg-warn-wash px-3 py-2 text-sm text-warn">These scans are of different ports ({a.port} and {b.port}): the comparison shows how different they are, not a change of one port.</p>}
            <CloudCompareView a={a.side} b={b.side} />
          </>
        ) : (
          <EmptyState title="These two scans cannot be compared yet.">
            {problems.join(" ")} Pick two analysed scans on the <Link href="/view" className="text-copper-deep underline">3D views</Link> page.
          </EmptyState>
        )}
        <ViewerCaution />
      </div>
    </>
  );
}
