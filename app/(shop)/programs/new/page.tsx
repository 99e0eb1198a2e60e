import { ProgramForm } from "@/components/programs/ProgramForm";
import { PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { headTypeOptions } from "@/db/queries/head-types";
import { PROGRAM_EDITORS } from "@/lib/programs/programs";
import { requirePageRole } from "../../../_server/session";

export const metadata = { title: "New program" };

export default async function NewProgramPage() {
  await requirePageRole(PROGRAM_EDITORS, "/programs/new");
  return (
    <>
      <PageHeader title="New program" subtitle="A casting, a port and a name; its revisions come next." />
      <ProgramForm headTypes={headTypeOptions(db())} />
    </>
  );
}
