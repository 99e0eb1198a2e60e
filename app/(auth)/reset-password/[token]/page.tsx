import { LinkProblem } from "@/components/auth/LinkProblem";
import { SetPasswordForm } from "@/components/auth/SetPasswordForm";
import { db } from "@/db/client";
import { inspectReset } from "@/lib/users/reset";
import { resetPasswordAction } from "../../actions";

export const metadata = { title: "Choose a new password" };
export const dynamic = "force-dynamic";

export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const check = inspectReset(db(), token);
  if (!check.ok) return <LinkProblem title="This link cannot be used" message={check.message} />;
  return (
    <>
      <h1 className="mb-4 text-xl font-bold">Choose a new password</h1>
      <SetPasswordForm token={token} email={check.email} askName={false} submitLabel="Save and sign in" action={resetPasswordAction} />
    </>
  );
}
