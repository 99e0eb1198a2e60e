"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { requestResetAction } from "@/app/(auth)/actions";
import { forgotSchema } from "@/lib/users/schema";
import { Button } from "../ui/Button";
import { Field, inputClass } from "../ui/Field";

export function ForgotPasswordForm() {
  const [done, setDone] = useState<string>();
  const [failure, setFailure] = useState<string>();
  const form = useForm<{ email: string }>({ resolver: zodResolver(forgotSchema), defaultValues: { email: "" } });
  const { errors, isSubmitting } = form.formState;
  if (done) return <p role="status" className="rounded-md bg-ok-wash px-3 py-2 text-sm text-ok">{done}</p>;
  return (
    <form
      noValidate
      className="flex flex-col gap-4"
      onSubmit={form.handleSubmit(async (values) => {
        const res = await requestResetAction(values);
        if (res.ok) setDone(res.message);
        else setFailure(res.message);
      })}
    >
      <Field label="E-mail" htmlFor="forgot-email" error={errors.email?.message}>
        <input id="forgot-email" type="email" autoComplete="username" className={inputClass(!!errors.email)} {...form.register("email")} />
      </Field>
      {failure && <p role="alert" className="text-sm text-bad">{failure}</p>}
      <Button type="submit" variant="primary" disabled={isSubmitting}>
        {isSubmitting ? "Sending…" : "Send the link"}
      </Button>
    </form>
  );
}
