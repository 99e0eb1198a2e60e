import { PlateForm } from "@/components/library/PlateForm";
import { PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { headTypeOptions } from "@/db/queries/head-types";
import { PLATE_EDITORS } from "@/lib/library/plates";
import { requirePageRole } from "../../../_server/session";

export const metadata = { title: "New fixture plate" };

export default async function NewPlatePage() {
  await requirePageRole(PLATE_EDITORS, "/plates/new");
  return (
    <>
      <PageHeader title="New fixture plate" />
      <PlateForm headTypes={headTypeOptions(db())} />
    </>
  );
}
