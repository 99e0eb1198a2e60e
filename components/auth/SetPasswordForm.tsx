"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { signIn } from "next-auth/react";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import type { ActionResult } from "@/app/(auth)/actions";
import { setPasswordSchema } from "@/lib/users/schema";
import { Button } from "../ui/Button";
import { Field, inputClass } from "../ui/Field";

type Values = z.input<typeof setPasswordSchema>;

/** Used by the invitation page (asks for a name) and the reset page; signs in on success. */
export function SetPasswordForm({
  token,
  email,
  askName,
  submitLabel,
  action,
}: {
  token: string;
  email: string;
  askName: boolean;
  submitLabel: string;
  action: (values: Values) => Promise<ActionResult>;
}) {
  const router = useRouter();
  const [failure, setFailure] = useState<string>();
  const form = useForm<Values>({ resolver: zodResolver(setPasswordSchema), defaultValues: { token, name: askName ? "" : undefined, password: "", confirm: "" } });
  const { errors, isSubmitting } = form.formState;

  const submit = form.handleSubmit(async (values) => {
    setFailure(undefined);
    if (askName && !values.name) {
      form.setError("name", { message: "Enter your name." });
      return;
    }
    const res = await action(values);
    if (!res.ok) {
      for (const [k, msgs] of Object.entries(res.fields ?? {})) form.setError(k as keyof Values, { message: msgs[0] });
      setFailure(res.message);
      return;
    }
    const signedIn = await signIn("credentials", { email, password: values.password, redirect: false });
    if (signedIn?.error) {
      router.replace("/sign-in");
      return;
    }
    router.replace("/");
    router.refresh();
  });

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      <input type="hidden" {...form.register("token")} />
      <p className="text-sm text-ink-soft">
        Account: <span className="font-semibold text-ink">{email}</span>
      </p>
      {askName && (
        <Field label="Your name" htmlFor="name" error={errors.name?.message}>
          <input id="name" autoComplete="name" className={inputClass(!!errors.name)} {...form.register("name")} />
        </Field>
      )}
      <Field label="New password" htmlFor="password" error={errors.password?.message} hint="At least 10 characters.">
        <input id="password" type="password" autoComplete="new-password" className={inputClass(!!errors.password)} {...form.register("password")} />
      </Field>
      <Field label="Repeat the password" htmlFor="confirm" error={errors.confirm?.message}>
        <input id="confirm" type="password" autoComplete="new-password" className={inputClass(!!errors.confirm)} {...form.register("confirm")} />
      </Field>
      {failure && (
        <p role="alert" className="rounded-md border border-bad/40 bg-bad-wash px-3 py-2 text-sm text-bad">
          {failure}
        </p>
      )}
      <Button type="submit" variant="primary" disabled={isSubmitting}>
        {isSubmitting ? "Saving…" : submitLabel}
      </Button>
    </form>
  );
}
