"use client";

/** Takes a file or photo off a record after asking, then refreshes the page. */
import { useRouter } from "next/navigation";
import { useState } from "react";
import { toast } from "sonner";
import { fetchJson } from "../table/fetch-json";
import { Button } from "../ui/Button";

export function RemoveButton({ url, name, from }: { url: string; name: string; from: string }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);

  const remove = async () => {
    if (!window.confirm(`Take ${name} off this ${from}? The stored copy stays in the audit trail.`)) return;
    setBusy(true);
    try {
      await fetchJson(url, { method: "DELETE" });
      toast.success(`${name} is no longer part of this ${from}.`);
      router.refresh();
    } catch (err) {
      toast.error(err instanceof Error ? err.message : "It could not be taken off.");
      setBusy(false);
    }
  };

  return (
    <Button variant="quiet" onClick={remove} disabled={busy} aria-label={`Remove ${name} from this ${from}`}>
      {busy ? "Removing…" : "Remove"}
    </Button>
  );
}
