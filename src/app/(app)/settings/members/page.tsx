import type { Metadata } from "next";
import { PageHeader, Panel } from "@/components/ui/page-header";
import { requireContext } from "@/server/auth/context";
import { listCustomers } from "@/server/db/queries/customers";
import { listInvitations, } from "@/server/db/queries/members";
import { listMembers } from "@/server/db/queries/memberships";
import { withScope } from "@/server/db/scope";
import { InvitationList, InviteForm } from "./invite-form";
import { MembersTable } from "./members-table";

export const metadata: Metadata = { title: "Members" };

export default async function MembersPage() {
  const context = await requireContext("members.manage");
  const { members, invitations, customers } = await withScope(context.scope, async (tx) => ({
    members: await listMembers(tx),
    invitations: await listInvitations(tx),
    customers: await listCustomers(tx, context.scope),
  }));
  return (
    <>
      <PageHeader eyebrow="Settings" title="Members" />
      <div className="grid gap-6 xl:grid-cols-[1fr_360px]">
        <Panel title={`${members.length} members`}>
          <MembersTable members={members} customers={customers} selfId={context.user?.id ?? ""} />
        </Panel>
        <div className="space-y-6">
          <Panel title="Invite someone">
            <InviteForm customers={customers} />
          </Panel>
          <Panel title="Invitations">
            <InvitationList invitations={invitations} />
          </Panel>
        </div>
      </div>
    </>
  );
}
