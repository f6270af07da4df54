import type { Metadata } from "next";
import { InviteUserForm } from "@/components/admin/invite-user-form";
import { UsersTable } from "@/components/admin/users-table";
import { Forbidden } from "@/components/shell/forbidden";
import { Card, PageHeader } from "@/components/ui/card";
import { pageUserCan } from "@/lib/server/auth";
import { listSites, listUsers } from "@/lib/server/queries/users";
import {
  changeRoleAction,
  disableUserAction,
  enableUserAction,
  inviteUserAction,
  setSiteAccessAction,
} from "./actions";

export const metadata: Metadata = { title: "Users" };

export default async function UsersPage() {
  const { user, allowed } = await pageUserCan("users.manage");
  if (!allowed) return <Forbidden what="User management" />;
  const [users, sites] = await Promise.all([listUsers(), listSites()]);
  return (
    <>
      <PageHeader
        title="Users"
        lead="Invite people, set their role and the sites they may see, or disable an account. A role change or disabling ends that person's sessions at once."
      />
      <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_22rem]">
        <Card className="min-w-0">
          <UsersTable
            users={users}
            sites={sites}
            currentUserId={user.id}
            actions={{ changeRole: changeRoleAction, setSites: setSiteAccessAction, disable: disableUserAction, enable: enableUserAction }}
          />
        </Card>
        <Card>
          <h2 className="mb-3 text-lg font-bold">Invite a person</h2>
          <InviteUserForm sites={sites} invite={inviteUserAction} />
        </Card>
      </div>
    </>
  );
}
