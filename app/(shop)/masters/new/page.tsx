import { MasterForm } from "@/components/library/MasterForm";
import { PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { headTypeOptions } from "@/db/queries/head-types";
import { peopleOptions } from "@/db/queries/library";
import { MASTER_EDITORS } from "@/lib/library/masters";
import { requirePageRole } from "../../../_server/session";

export const metadata = { title: "Register a master" };

export default async function NewMasterPage({ searchParams }: { searchParams: Promise<{ headTypeId?: string }> }) {
  await requirePageRole(MASTER_EDITORS, "/masters/new");
  const sp = await searchParams;
  return (
    <>
      <PageHeader title="Register a master head" subtitle="One hand-ported head: what was done to each port, and the readings taken." />
      <MasterForm headTypes={headTypeOptions(db())} porters={peopleOptions(db(), "porter")} initial={sp.headTypeId ? { headTypeId: Number(sp.headTypeId) } : undefined} />
    </>
  );
}
