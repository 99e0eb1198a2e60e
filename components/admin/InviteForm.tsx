"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useQueryClient } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { toast } from "sonner";
import { ROLES, ROLE_LABEL } from "@/lib/auth/roles";
import { inviteSchema, type InviteInput } from "@/lib/users/schema";
import { ApiError, fetchJson } from "../table/fetch-json";
import { Button } from "../ui/Button";
import { Field, inputClass } from "../ui/Field";

export function InviteForm() {
  const qc = useQueryClient();
  const form = useForm<InviteInput>({ resolver: zodResolver(inviteSchema), defaultValues: { email: "", role: "porter" } });
  const { errors, isSubmitting } = form.formState;

  const submit = form.handleSubmit(async (values) => {
    try {
      await fetchJson("/api/invitations", { method: "POST", body: JSON.stringify(values) });
      toast.success(`Invitation sent to ${values.email}.`);
      form.reset({ email: "", role: values.role });
      qc.invalidateQueries({ queryKey: ["invitations"] });
    } catch (err) {
      if (err instanceof ApiError && err.fields) {
        for (const [k, msgs] of Object.entries(err.fields)) form.setError(k as keyof InviteInput, { message: msgs[0] });
      }
      toast.error(err instanceof Error ? err.message : "The invitation could not be sent.");
    }
  });

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3" aria-label="Invite someone">
      <Field label="E-mail" htmlFor="invite-email" error={errors.email?.message}>
        <input id="invite-email" type="email" autoComplete="off" className={inputClass(!!errors.email)} {...form.register("email")} />
      </Field>
      <Field label="Role" htmlFor="invite-role" error={errors.role?.message}>
        <select id="invite-role" className={inputClass(!!errors.role)} {...form.register("role")}>
          {ROLES.map((r) => (
            <option key={r} value={r}>
              {ROLE_LABEL[r]}
            </option>
          ))}
        </select>
      </Field>
      <Button type="submit" variant="primary" disabled={isSubmitting}>
        {isSubmitting ? "Sending…" : "Send invitation"}
      </Button>
      <p className="text-xs text-ink-faint">The link works once and expires after 72 hours.</p>
    </form>
  );
}
