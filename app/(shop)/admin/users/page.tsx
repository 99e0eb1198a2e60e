import { InviteForm } from "@/components/admin/InviteForm";
import { PendingInvitations } from "@/components/admin/PendingInvitations";
import { UsersTable } from "@/components/admin/UsersTable";
import { Card, PageHeader } from "@/components/ui/Card";
import { ADMINS } from "@/lib/auth/roles";
import { env } from "@/lib/env";
import { requirePageRole } from "../../../_server/session";

export const metadata = { title: "Users and invitations" };

export default async function UsersPage() {
  const actor = await requirePageRole(ADMINS, "/admin/users");
  const inbox = env().MAIL_INBOX_URL;
  return (
    <>
      <PageHeader
        title="Users and invitations"
        subtitle="Invite people by e-mail, change roles, deactivate accounts. A deactivated person is signed out at once."
        actions={
          inbox ? (
            <a href={inbox} target="_blank" rel="noreferrer" className="text-sm font-semibold text-copper underline" data-testid="mail-inbox-link">
              Open the demo mail inbox
            </a>
          ) : null
        }
      />
      <div className="grid gap-6 xl:grid-cols-[1fr_22rem]">
        <UsersTable currentUserId={actor.id} />
        <div className="flex flex-col gap-4">
          <Card title="Invite someone">
            <InviteForm />
          </Card>
          <Card title="Open invitations">
            <PendingInvitations />
          </Card>
        </div>
      </div>
    </>
  );
}
