import { HeadTypeForm } from "@/components/library/HeadTypeForm";
import { PageHeader } from "@/components/ui/Card";
import { HEAD_TYPE_EDITORS } from "@/lib/library/head-types";
import { requirePageRole } from "../../../_server/session";

export const metadata = { title: "New head type" };

export default async function NewHeadTypePage() {
  await requirePageRole(HEAD_TYPE_EDITORS, "/head-types/new");
  return (
    <>
      <PageHeader title="New head type" subtitle="A casting: its number, engine family and valve sizes." />
      <HeadTypeForm />
    </>
  );
}
