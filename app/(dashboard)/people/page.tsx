import type { Metadata } from "next";

import { listMembersOfOrganization } from "@/db/queries/memberships";
import { listOpenInvitations } from "@/db/queries/invitations";
import { requirePage } from "@/lib/server/auth/guards";
import { roleLabels } from "@/lib/server/auth/permissions";

import { formatDateTime } from "../_components/format-date-time";
import { PageHeader } from "../_components/page-header";
import { InviteForm } from "./_components/invite-form";
import { MemberRow } from "./_components/member-row";
import { RevokeInvitationButton } from "./_components/revoke-invitation-button";

export const metadata: Metadata = { title: "People" };

export default async function PeoplePage() {
  const context = await requirePage("/people");
  const organizationId = context.active!.organizationId;
  const [members, invitations] = await Promise.all([listMembersOfOrganization(organizationId), listOpenInvitations(organizationId)]);
  return (
    <>
      <PageHeader title="People" lead={`Who works in ${context.active!.organizationName}, and in which role.`} />
      <div className="grid gap-6 lg:grid-cols-[1fr_20rem]">
        <section aria-labelledby="members-heading">
          <h2 id="members-heading" className="mb-2 font-semibold">
            Members ({members.length})
          </h2>
          <table className="w-full border-collapse text-left">
            <thead className="text-xs uppercase tracking-wide text-ink-soft">
              <tr>
                <th className="pb-1 font-medium">Name</th>
                <th className="pb-1 font-medium">E-mail</th>
                <th className="pb-1 font-medium">Role</th>
                <th className="pb-1 font-medium">
                  <span className="sr-only">Remove</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {members.map((m) => (
                <MemberRow key={m.membershipId} {...m} isSelf={m.userId === context.user.id} />
              ))}
            </tbody>
          </table>
          <h2 className="mb-2 mt-6 font-semibold">Open invitations ({invitations.length})</h2>
          {invitations.length === 0 ? (
            <p className="text-ink-soft">None.</p>
          ) : (
            <ul className="divide-y divide-rule rounded border border-rule bg-sheet">
              {invitations.map((i) => (
                <li key={i.id} className="flex items-center justify-between gap-2 px-3 py-2">
                  <span>
                    {i.email} <span className="text-ink-soft">· {roleLabels[i.role]} · expires {formatDateTime(i.expiresAt)}</span>
                  </span>
                  <RevokeInvitationButton invitationId={i.id} email={i.email} />
                </li>
              ))}
            </ul>
          )}
        </section>
        <InviteForm />
      </div>
    </>
  );
}
