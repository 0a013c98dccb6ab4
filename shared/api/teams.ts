// Teams, their members and invitations.
import { z } from "zod";
import { emailField, isoTime, nameText, roles } from "./common.js";

const teamName = nameText(100, "Give the team a name.");
export const teamRequest = z.object({ name: teamName }).meta({ id: "TeamRequest" });
// A rename, or how many approvals make a revision approved.
export const teamChangesRequest = z
  .object({ name: teamName.optional(), requiredApprovals: z.number().int().min(1, { error: "At least one approval." }).max(10, { error: "At most 10 approvals." }).optional() })
  .refine((changes) => changes.name !== undefined || changes.requiredApprovals !== undefined, { error: "Give a name or a number of required approvals." })
  .meta({ id: "TeamChangesRequest" });
export const roleRequest = z.object({ role: z.enum(roles) }).meta({ id: "RoleRequest" });
export const invitationRequest = z.object({ email: emailField, role: z.enum(roles) }).meta({ id: "InvitationRequest" });

export const team = z
  .object({ id: z.uuid(), name: z.string(), personal: z.boolean(), role: z.enum(roles), requiredApprovals: z.number().int(), createdAt: isoTime })
  .meta({ id: "Team" });
const member = z.object({ userId: z.string(), name: z.string(), email: z.string(), role: z.enum(roles) }).meta({ id: "Member" });
export const memberList = z.object({ members: z.array(member) }).meta({ id: "MemberList" });
const invitation = z
  .object({ id: z.uuid(), email: z.string(), role: z.enum(roles), expiresAt: isoTime, acceptedAt: isoTime.nullable(), createdAt: isoTime })
  .meta({ id: "Invitation" });
// Inviting someone as owner says what an owner can do.
export const createdInvitation = invitation.extend({ warning: z.string().optional() }).meta({ id: "CreatedInvitation" });
export const invitationList = z.object({ invitations: z.array(invitation) }).meta({ id: "InvitationList" });
export const invitationPreview = z
  .object({ team: z.object({ id: z.uuid(), name: z.string() }), role: z.enum(roles), email: z.string(), invitedBy: z.string().nullable(), expiresAt: isoTime })
  .meta({ id: "InvitationPreview" });
export const acceptedInvitation = z.object({ team: z.object({ id: z.uuid(), name: z.string(), role: z.enum(roles), personal: z.boolean() }) }).meta({ id: "AcceptedInvitation" });
