"use server";

import { headers } from "next/headers";
import { db } from "@/db/client";
import { isAppError, type FieldErrors } from "@/lib/errors";
import { acceptInvitation } from "@/lib/users/invite";
import { requestPasswordReset, resetPassword } from "@/lib/users/reset";

export type ActionResult = { ok: true; email?: string; message?: string } | { ok: false; message: string; fields?: FieldErrors };

async function origin(): Promise<string> {
  if (process.env.APP_URL) return process.env.APP_URL;
  const h = await headers();
  return `${h.get("x-forwarded-proto") ?? "http"}://${h.get("host") ?? "127.0.0.1:3000"}`;
}

function failure(err: unknown): ActionResult {
  if (isAppError(err)) return { ok: false, message: err.message, fields: err.fields };
  console.error("[auth action]", err);
  return { ok: false, message: "Something went wrong on our side. Try again in a moment." };
}

export async function acceptInvitationAction(input: unknown): Promise<ActionResult> {
  try {
    const user = await acceptInvitation(db(), input);
    return { ok: true, email: user.email };
  } catch (err) {
    return failure(err);
  }
}

export async function requestResetAction(input: unknown): Promise<ActionResult> {
  try {
    await requestPasswordReset(db(), input, await origin());
    return { ok: true, message: "If that address belongs to an active account, a reset link is on its way. It works once, for two hours." };
  } catch (err) {
    return failure(err);
  }
}

export async function resetPasswordAction(input: unknown): Promise<ActionResult> {
  try {
    const { email } = await resetPassword(db(), input);
    return { ok: true, email };
  } catch (err) {
    return failure(err);
  }
}
