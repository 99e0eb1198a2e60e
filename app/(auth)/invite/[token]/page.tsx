import { LinkProblem } from "@/components/auth/LinkProblem";
import { SetPasswordForm } from "@/components/auth/SetPasswordForm";
import { db } from "@/db/client";
import { ROLE_LABEL } from "@/lib/auth/roles";
import { inspectInvitation } from "@/lib/users/invite";
import { acceptInvitationAction } from "../../actions";

export const metadata = { title: "Accept invitation" };
export const dynamic = "force-dynamic";

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const check = inspectInvitation(db(), token);
  if (!check.ok) return <LinkProblem title="This invitation cannot be used" message={check.message} />;
  return (
    <>
      <h1 className="mb-1 text-xl font-bold">Welcome to Portolan</h1>
      <p className="mb-4 text-sm text-ink-soft">You are invited as {ROLE_LABEL[check.role]}. Choose a password to finish.</p>
      <SetPasswordForm token={token} email={check.email} askName submitLabel="Create my account" action={acceptInvitationAction} />
    </>
  );
}
