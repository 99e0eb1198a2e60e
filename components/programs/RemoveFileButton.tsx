"use client";

/** Takes a wrong or outdated upload off a draft revision, after asking. */
import { useRouter } from "next/navigation";
import { useState } from "react";
import { toast } from "sonner";
import { fetchJson } from "../table/fetch-json";
import { Button } from "../ui/Button";

export function RemoveFileButton({ revisionId, fileId, name }: { revisionId: number; fileId: number; name: string }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);

  const remove = async () => {
    if (!window.confirm(`Take ${name} off this draft? The stored copy stays in the audit trail.`)) return;
    setBusy(true);
    try {
      await fetchJson(`/api/revisions/${revisionId}/files/${fileId}`, { method: "DELETE" });
      toast.success(`${name} is no longer part of this revision.`);
      router.refresh();
    } catch (err) {
      toast.error(err instanceof Error ? err.message : "The file could not be taken off.");
      setBusy(false);
    }
  };

  return (
    <Button variant="quiet" onClick={remove} disabled={busy} aria-label={`Remove ${name} from this revision`}>
      {busy ? "Removing…" : "Remove"}
    </Button>
  );
}
