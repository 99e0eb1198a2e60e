"use client";

/** Print, PDF, and for lead and admin edit and delete. Hidden on paper. */
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { toast } from "sonner";
import { fetchJson } from "../table/fetch-json";
import { Button, buttonClass } from "../ui/Button";

export function FlowSheetActions({ id, canEdit }: { id: number; canEdit: boolean }) {
  const router = useRouter();
  const [deleting, setDeleting] = useState(false);

  const remove = async () => {
    if (!window.confirm(`Delete flow test #${id}? The audit trail keeps what it held.`)) return;
    setDeleting(true);
    try {
      await fetchJson(`/api/flow-tests/${id}`, { method: "DELETE" });
      toast.success(`Flow test #${id} deleted.`);
      router.push("/flow-tests");
      router.refresh();
    } catch (err) {
      toast.error(err instanceof Error ? err.message : "The test could not be deleted.");
      setDeleting(false);
    }
  };

  return (
    <div className="flex flex-wrap gap-2 print:hidden">
      <Button onClick={() => window.print()}>Print flow sheet</Button>
      <a href={`/api/flow-tests/${id}/pdf`} target="_blank" rel="noreferrer" className={buttonClass("secondary")} data-testid="open-pdf">
        Open PDF
      </a>
      <a href={`/api/flow-tests/${id}/pdf?download=1`} className={buttonClass("quiet")} download={`flow-test-${id}.pdf`}>
        Download PDF
      </a>
      {canEdit && (
        <>
          <Link href={`/flow-tests/${id}/edit`} className={buttonClass("secondary")}>
            Edit
          </Link>
          <Button variant="danger" onClick={remove} disabled={deleting}>
            {deleting ? "Deleting…" : "Delete"}
          </Button>
        </>
      )}
    </div>
  );
}
