export { useAcceptInvitation } from "./api/accept-invitation";
export { useInvitation } from "./api/get-invitation";
export { useTeamMembers } from "./api/get-team-members";
export { CreateTeamForm } from "./components/create-team-form";
export { InviteMemberForm } from "./components/invite-member-form";
export { RequiredApprovals } from "./components/required-approvals";
export { TeamMembers } from "./components/team-members";
