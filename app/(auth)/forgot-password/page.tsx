import Link from "next/link";
import { ForgotPasswordForm } from "@/components/auth/ForgotPasswordForm";

export const metadata = { title: "Forgotten password" };

export default function ForgotPasswordPage() {
  return (
    <>
      <h1 className="mb-2 text-xl font-bold">Forgotten password</h1>
      <p className="mb-4 text-sm text-ink-soft">We will e-mail you a one-time link to choose a new password.</p>
      <ForgotPasswordForm />
      <Link href="/sign-in" className="mt-4 inline-block text-sm text-copper underline">
        Back to sign-in
      </Link>
    </>
  );
}
