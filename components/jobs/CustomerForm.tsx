"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { toast } from "sonner";
import type { z } from "zod";
import { customerSchema } from "@/lib/jobs/schema";
import { fetchJson } from "../table/fetch-json";
import { Button } from "../ui/Button";
import { Field, inputClass } from "../ui/Field";
import { showServerErrors } from "./server-errors";

type In = z.input<typeof customerSchema>;
type Out = z.output<typeof customerSchema>;

const EMPTY: In = { name: "", contactName: "", email: "", phone: "", address: "", notes: "" };

/** Create (no `customer`) or edit a customer. */
export function CustomerForm({ customer }: { customer?: Out & { id: number } }) {
  const qc = useQueryClient();
  const router = useRouter();
  const form = useForm<In, unknown, Out>({ resolver: zodResolver(customerSchema), defaultValues: customer ?? EMPTY });
  const { errors, isSubmitting } = form.formState;

  const submit = form.handleSubmit(async (values) => {
    try {
      const saved = await fetchJson<{ id: number; name: string }>(customer ? `/api/customers/${customer.id}` : "/api/customers", {
        method: customer ? "PATCH" : "POST",
        body: JSON.stringify(values),
      });
      toast.success(customer ? `${saved.name} saved.` : `${saved.name} added.`);
      qc.invalidateQueries({ queryKey: ["customers"] });
      if (customer) router.refresh();
      else form.reset(EMPTY);
    } catch (err) {
      showServerErrors(form, err, "The customer could not be saved.");
    }
  });

  const id = (f: string) => `customer-${customer?.id ?? "new"}-${f}`;
  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3" aria-label={customer ? "Edit customer" : "Add a customer"}>
      <Field label="Name" htmlFor={id("name")} error={errors.name?.message}>
        <input id={id("name")} className={inputClass(!!errors.name)} {...form.register("name")} />
      </Field>
      <Field label="Contact person" htmlFor={id("contact")} error={errors.contactName?.message}>
        <input id={id("contact")} className={inputClass(!!errors.contactName)} {...form.register("contactName")} />
      </Field>
      <Field label="E-mail" htmlFor={id("email")} error={errors.email?.message} hint="Shipping notices go here.">
        <input id={id("email")} type="email" className={inputClass(!!errors.email)} {...form.register("email")} />
      </Field>
      <Field label="Phone" htmlFor={id("phone")} error={errors.phone?.message}>
        <input id={id("phone")} className={inputClass(!!errors.phone)} {...form.register("phone")} />
      </Field>
      <Field label="Address" htmlFor={id("address")} error={errors.address?.message}>
        <textarea id={id("address")} rows={2} className={inputClass(!!errors.address)} {...form.register("address")} />
      </Field>
      <Field label="Notes" htmlFor={id("notes")} error={errors.notes?.message}>
        <textarea id={id("notes")} rows={2} className={inputClass(!!errors.notes)} {...form.register("notes")} />
      </Field>
      <Button type="submit" variant="primary" disabled={isSubmitting}>
        {isSubmitting ? "Saving…" : customer ? "Save changes" : "Add customer"}
      </Button>
    </form>
  );
}
