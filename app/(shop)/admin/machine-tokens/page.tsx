import { MachineTokens } from "@/components/jobs/MachineTokens";
import { Caution, PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { machineOptions } from "@/db/queries/machine-tokens";
import { ADMINS } from "@/lib/auth/roles";
import { env } from "@/lib/env";
import { requirePageRole } from "../../../_server/session";

export const metadata = { title: "Machine tokens" };

export default async function MachineTokensPage() {
  await requirePageRole(ADMINS, "/admin/machine-tokens");
  const machines = machineOptions(db()).filter((m) => m.active);
  return (
    <>
      <PageHeader
        title="Machine tokens"
        subtitle="A token lets one machine's cell computer fetch the released programs of the jobs planned on that machine. Every fetch is in the audit log."
      />
      <div className="mb-4">
        <Caution title="Handing programs to a machine">
          <p>The machine gets the released revision of the job&apos;s chosen program only, and the file is checked against its SHA-256 on arrival.</p>
          <p>Still prove the first head of every job (first-article check) and keep guards closed and eye protection on while it cuts.</p>
        </Caution>
      </div>
      <MachineTokens machines={machines} appUrl={env().APP_URL} />
    </>
  );
}
