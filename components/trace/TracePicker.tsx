"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Button } from "../ui/Button";
import { Field, inputClass } from "../ui/Field";

export function RevisionPicker({ revisions }: { revisions: Array<{ id: number; label: string; state: string; castingNumber: string; cuts: number }> }) {
  const router = useRouter();
  const [id, setId] = useState(revisions[0]?.id.toString() ?? "");
  if (revisions.length === 0) return <p className="text-sm text-ink-soft">No revision has been released yet, so nothing has been cut.</p>;
  return (
    <form
      className="flex flex-wrap items-end gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        if (id) router.push(`/trace/revision/${id}`);
      }}
    >
      <Field label="Revision" htmlFor="trace-revision">
        <select id="trace-revision" className={inputClass()} value={id} onChange={(e) => setId(e.target.value)}>
          {revisions.map((r) => (
            <option key={r.id} value={r.id}>
              {r.castingNumber} · {r.label} ({r.state}, {r.cuts} {r.cuts === 1 ? "cut" : "cuts"})
            </option>
          ))}
        </select>
      </Field>
      <Button type="submit" variant="primary">
        Trace revision
      </Button>
    </form>
  );
}

export function SerialPicker() {
  const router = useRouter();
  const [serial, setSerial] = useState("");
  return (
    <form
      className="flex flex-wrap items-end gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        if (serial.trim()) router.push(`/trace/head/${encodeURIComponent(serial.trim())}`);
      }}
    >
      <Field label="Head serial" htmlFor="trace-serial">
        <input id="trace-serial" className={inputClass()} value={serial} onChange={(e) => setSerial(e.target.value)} placeholder="e.g. HV-0001" />
      </Field>
      <Button type="submit" variant="primary" disabled={!serial.trim()}>
        Trace head
      </Button>
    </form>
  );
}
