"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";

import { getActionOrganizationId, runAction, type ActionResult } from "@/lib/server/auth/guards";
import { inviteMember as invite } from "@/lib/server/people/invite-member";
import { changeMemberRole as changeRole, creatorKeyChoices, removeMember as remove, revokeInvitation as revoke } from "@/lib/server/people/manage-members";
import { emailSchema, idSchema, roleSchema } from "@/lib/server/validation";

const inviteSchema = z.object({ email: emailSchema, role: roleSchema });

export async function inviteMember(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("people/inviteMember", inviteSchema, formData, async ({ email, role }, context) => {
    await invite({ organizationId: getActionOrganizationId(context), invitedBy: context!.user, email, role });
    revalidatePath("/people");
    return { ok: true, message: `Invitation sent to ${email}.` };
  });
}

const changeRoleSchema = z.object({ membershipId: idSchema("mem"), role: roleSchema });

export async function changeMemberRole(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("people/changeMemberRole", changeRoleSchema, formData, async ({ membershipId, role }, context) => {
    await changeRole({ organizationId: getActionOrganizationId(context), membershipId, role });
    revalidatePath("/people");
    return { ok: true, message: "Role changed. It applies from the person's next request." };
  });
}

const removeSchema = z.object({
  membershipId: idSchema("mem"),
  creatorKeys: z.enum(creatorKeyChoices, { error: "Choose whether the API keys this person made keep working." }),
});

export async function removeMember(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("people/removeMember", removeSchema, formData, async ({ membershipId, creatorKeys }, context) => {
    const { revokedKeys } = await remove({ organizationId: getActionOrganizationId(context), membershipId, creatorKeys });
    revalidatePath("/people");
    const keys = creatorKeys === "keep" ? " The API keys they made keep working." : ` ${revokedKeys} API key${revokedKeys === 1 ? "" : "s"} they made revoked.`;
    return { ok: true, message: `Removed from the organization.${keys}` };
  });
}

const invitationSchema = z.object({ invitationId: idSchema("inv") });

export async function revokeInvitation(_prev: ActionResult | null, formData: FormData): Promise<ActionResult> {
  return runAction("people/revokeInvitation", invitationSchema, formData, async ({ invitationId }, context) => {
    await revoke({ organizationId: getActionOrganizationId(context), invitationId });
    revalidatePath("/people");
    return { ok: true, message: "Invitation withdrawn." };
  });
}
