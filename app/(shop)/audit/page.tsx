import { AuditTable } from "@/components/audit/AuditTable";
import { Badge } from "@/components/ui/Badge";
import { Card, PageHeader } from "@/components/ui/Card";
import { db } from "@/db/client";
import { auditVocabulary } from "@/db/queries/audit";
import { verifyAuditChain } from "@/lib/audit/verify";
import { requirePageRole } from "../../_server/session";

export const metadata = { title: "Audit log" };

export default async function AuditPage() {
  await requirePageRole(["auditor", "lead", "admin"], "/audit");
  const chain = verifyAuditChain(db().$client);
  const vocabulary = auditVocabulary(db());
  return (
    <>
      <PageHeader title="Audit log" subtitle="Every change, who made it and when, with the record before and after. Append-only and hash-chained." />
      <Card title="Chain check" className="mb-4">
        {chain.ok ? (
          <p className="flex flex-wrap items-center gap-2 text-sm" data-testid="chain-state">
            <Badge tone="ok">Intact</Badge> All {chain.events} events link up; the latest hash is <code className="font-mono text-xs">{chain.lastHash.slice(0, 16)}…</code>
          </p>
        ) : (
          <p className="flex flex-wrap items-center gap-2 text-sm" data-testid="chain-state">
            <Badge tone="bad">Broken</Badge> Event #{chain.brokenAt}: {chain.reason}. Events before it are sound; from it on, the record cannot be trusted.
          </p>
        )}
        <p className="mt-2 text-xs text-ink-faint">
          The same check runs from the shell: <code className="font-mono">npm run -s portolan -- audit verify</code>.
        </p>
      </Card>
      <AuditTable entities={vocabulary.entities} actions={vocabulary.actions} />
    </>
  );
}
