"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { toast } from "sonner";
import type { z } from "zod";
import type { MachineTokenRow } from "@/db/queries/machine-tokens";
import { issueTokenSchema } from "@/lib/delivery/schema";
import { fetchJson } from "../table/fetch-json";
import { Badge } from "../ui/Badge";
import { Button } from "../ui/Button";
import { Card, EmptyState } from "../ui/Card";
import { Field, inputClass } from "../ui/Field";
import { formatDateTime } from "../ui/format";
import { idOrNull } from "./options";
import { showServerErrors } from "./server-errors";

type In = z.input<typeof issueTokenSchema>;
type Out = z.output<typeof issueTokenSchema>;
type Issued = { id: number; token: string; machineName: string; label: string };

function IssueForm({ machines, onIssued }: { machines: Array<{ id: number; name: string }>; onIssued: (t: Issued) => void }) {
  const qc = useQueryClient();
  const form = useForm<In, unknown, Out>({ resolver: zodResolver(issueTokenSchema), defaultValues: { machineId: machines[0]?.id, label: "" } });
  const { errors, isSubmitting } = form.formState;
  const submit = form.handleSubmit(async (values) => {
    try {
      const issued = await fetchJson<Issued>("/api/machine-tokens", { method: "POST", body: JSON.stringify(values) });
      onIssued(issued);
      form.reset({ machineId: values.machineId, label: "" });
      qc.invalidateQueries({ queryKey: ["machine-tokens"] });
    } catch (err) {
      showServerErrors(form, err, "The token could not be issued.");
    }
  });
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3" aria-label="Issue a machine token">
      <Field label="Machine" htmlFor="token-machine" error={errors.machineId?.message}>
        <select id="token-machine" className={inputClass(!!errors.machineId)} {...form.register("machineId", { setValueAs: idOrNull })}>
          {machines.map((m) => (
            <option key={m.id} value={m.id}>
              {m.name}
            </option>
          ))}
        </select>
      </Field>
      <Field label="Label" htmlFor="token-label" error={errors.label?.message} hint="Where the token lives, e.g. “cell 2 control PC”.">
        <input id="token-label" className={inputClass(!!errors.label)} {...form.register("label")} />
      </Field>
      <Button type="submit" variant="primary" disabled={isSubmitting || machines.length === 0}>
        {isSubmitting ? "Issuing…" : "Issue token"}
      </Button>
    </form>
  );
}

function ShownOnce({ issued, appUrl, onDone }: { issued: Issued; appUrl: string; onDone: () => void }) {
  return (
    <div role="status" className="rounded-md border border-copper/50 bg-copper-wash p-4 text-sm" data-testid="issued-token">
      <p className="font-bold text-copper-deep">
        Token for {issued.machineName} ({issued.label}) — shown this once
      </p>
      <p className="mt-1">Copy it to the cell computer now. Portolan keeps only its hash and cannot show it again.</p>
      <code className="mt-2 block select-all break-all rounded bg-card p-2 font-mono text-xs" data-testid="token-value">
        {issued.token}
      </code>
      <p className="mt-2 text-ink-soft">On the cell computer:</p>
      <pre className="mt-1 overflow-x-auto rounded bg-card p-2 font-mono text-xs">
        {`export PORTOLAN_MACHINE_TOKEN=<the token>\nnpm run -s portolan -- program fetch --url ${appUrl} --job J-… --port intake --out program.nc`}
      </pre>
      <div className="mt-3 flex gap-2">
        <Button
          variant="secondary"
          onClick={() =>
            navigator.clipboard?.writeText(issued.token).then(
              () => toast.success("Copied."),
              () => toast.error("Copy by hand: select the token above."),
            )
          }
        >
          Copy
        </Button>
        <Button variant="quiet" onClick={onDone}>
          I have stored it
        </Button>
      </div>
    </div>
  );
}

export function MachineTokens({ machines, appUrl }: { machines: Array<{ id: number; name: string }>; appUrl: string }) {
  const qc = useQueryClient();
  const [issued, setIssued] = useState<Issued | null>(null);
  const list = useQuery({ queryKey: ["machine-tokens"], queryFn: () => fetchJson<{ rows: MachineTokenRow[] }>("/api/machine-tokens") });
  const revoke = useMutation({
    mutationFn: (id: number) => fetchJson(`/api/machine-tokens/${id}`, { method: "DELETE" }),
    onSuccess: () => {
      toast.success("Token revoked; the machine can no longer fetch programs with it.");
      qc.invalidateQueries({ queryKey: ["machine-tokens"] });
    },
    onError: (err: Error) => toast.error(err.message),
  });
  const rows = list.data?.rows ?? [];
  return (
    <div className="grid gap-6 xl:grid-cols-[1fr_22rem]">
      <div className="flex min-w-0 flex-col gap-4">
        {issued && <ShownOnce issued={issued} appUrl={appUrl} onDone={() => setIssued(null)} />}
        {list.isError ? (
          <div role="alert" className="rounded-md border border-bad/40 bg-bad-wash px-4 py-3 text-sm text-bad">
            Could not load the tokens: {(list.error as Error).message}
          </div>
        ) : rows.length === 0 && !list.isPending ? (
          <EmptyState title="No machine tokens yet.">Issue one per cell computer that fetches programs.</EmptyState>
        ) : (
          <div className="overflow-x-auto rounded-lg border border-rule bg-card">
            <table className="w-full text-sm">
              <thead className="bg-paper-deep text-left text-ink-soft">
                <tr>
                  <th className="px-3 py-2 font-semibold">Machine</th>
                  <th className="px-3 py-2 font-semibold">Label</th>
                  <th className="px-3 py-2 font-semibold">Issued</th>
                  <th className="px-3 py-2 font-semibold">Last used</th>
                  <th className="px-3 py-2 font-semibold">State</th>
                  <th className="px-3 py-2" />
                </tr>
              </thead>
              <tbody>
                {rows.map((t) => (
                  <tr key={t.id} className="border-t border-rule/60" data-testid={`token-row-${t.id}`}>
                    <td className="px-3 py-2">{t.machineName}</td>
                    <td className="px-3 py-2">{t.label}</td>
                    <td className="px-3 py-2">
                      <span className="whitespace-nowrap">{formatDateTime(t.createdAt)}</span>
                      {t.createdByName && <span className="block text-xs text-ink-soft">by {t.createdByName}</span>}
                    </td>
                    <td className="whitespace-nowrap px-3 py-2">{t.lastUsedAt ? formatDateTime(t.lastUsedAt) : "never"}</td>
                    <td className="px-3 py-2">
                      {t.revokedAt ? (
                        <>
                          <Badge tone="neutral">Revoked</Badge>
                          <span className="block whitespace-nowrap text-xs text-ink-soft">{formatDateTime(t.revokedAt)}</span>
                        </>
                      ) : (
                        <Badge tone="ok">Active</Badge>
                      )}
                    </td>
                    <td className="px-3 py-2 text-right">
                      {!t.revokedAt && (
                        <Button
                          variant="danger"
                          disabled={revoke.isPending}
                          onClick={() => window.confirm(`Revoke "${t.label}" for ${t.machineName}?`) && revoke.mutate(t.id)}
                        >
                          Revoke
                        </Button>
                      )}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </div>
      <Card title="Issue a token" className="self-start">
        {machines.length === 0 ? <p className="text-sm text-ink-soft">Add a machine first.</p> : <IssueForm machines={machines} onIssued={setIssued} />}
      </Card>
    </div>
  );
}
