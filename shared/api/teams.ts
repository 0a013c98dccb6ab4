// Teams, their members and invitations.
import { z } from "zod";
import { emailField, isoTime, roles } from "./common.js";

const teamName = z.string().trim().min(1, { error: "Give the team a name." }).max(100);
export const teamRequest = z.object({ name: teamName }).meta({ id: "TeamRequest" });
export const roleRequest = z.object({ role: z.enum(roles) }).meta({ id: "RoleRequest" });
export const invitationRequest = z.object({ email: emailField, role: z.enum(roles) }).meta({ id: "InvitationRequest" });

export const team = z.object({ id: z.uuid(), name: z.string(), personal: z.boolean(), role: z.enum(roles), createdAt: isoTime }).meta({ id: "Team" });
export const member = z.object({ userId: z.string(), name: z.string(), email: z.string(), role: z.enum(roles) }).loose().meta({ id: "Member" });
export const memberList = z.object({ members: z.array(member) }).meta({ id: "MemberList" });
export const invitation = z.object({ id: z.uuid(), email: z.string(), role: z.enum(roles), expiresAt: isoTime }).loose().meta({ id: "Invitation" });
export const invitationList = z.object({ invitations: z.array(invitation) }).meta({ id: "InvitationList" });
export const invitationPreview = z.object({ team: z.object({ name: z.string() }).loose(), role: z.enum(roles), expiresAt: isoTime }).loose().meta({ id: "InvitationPreview" });
export const acceptedInvitation = z.object({ team: z.object({ id: z.uuid(), name: z.string(), role: z.enum(roles), personal: z.boolean() }) }).meta({ id: "AcceptedInvitation" });
