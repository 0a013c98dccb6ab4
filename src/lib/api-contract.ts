// The one door from the client to the API contract (shared/api): the types of what the server sends and takes.
import type { z } from "zod";
import type * as accounts from "../../shared/api/accounts";
import type * as attachments from "../../shared/api/attachments";
import type * as cells from "../../shared/api/cells";
import type * as networks from "../../shared/api/networks";
import type * as reviews from "../../shared/api/reviews";
import type * as revisions from "../../shared/api/revisions";
import type * as shares from "../../shared/api/shares";
import type * as teams from "../../shared/api/teams";
import type * as valueSets from "../../shared/api/value-sets";
import type { ResultName as EngineResultName } from "./engine-types";

export type { Role, Verdict } from "../../shared/api/common";
export { roleAtLeast } from "../../shared/api/common";
export { roles } from "../../shared/api/common";
export type { CreateTokenRequest, CreatedToken, TokenList, TokenScope } from "../../shared/api/tokens";
// What the engine owns inside the answers: a circuit, its diagnostics and check details, one result's printed forms.
export type { CheckDetail, Diagnostic, ExactExpression, NetworkInput as Circuit } from "./engine-types";

// ---- accounts ----
export type Me = z.infer<typeof accounts.me>;
export type SettingsAnswer = z.infer<typeof accounts.settingsAnswer>;
export type SettingsRequest = z.input<typeof accounts.settingsRequest>;
export type SignupRequest = z.input<typeof accounts.signupRequest>;
export type LoginRequest = z.input<typeof accounts.loginRequest>;
export type EmailLinkRequest = z.input<typeof accounts.emailLinkRequest>;
export type PasswordResetRequest = z.input<typeof accounts.passwordResetRequest>;
export type PasswordResetConfirmRequest = z.input<typeof accounts.passwordResetConfirmRequest>;
export type UserAnswer = z.infer<typeof accounts.userAnswer>;
export type SentAnswer = z.infer<typeof accounts.sentAnswer>;

// ---- teams ----
export type Team = z.infer<typeof teams.team>;
export type TeamRequest = z.input<typeof teams.teamRequest>;
export type TeamChangesRequest = z.input<typeof teams.teamChangesRequest>;
export type RoleRequest = z.input<typeof teams.roleRequest>;
export type InvitationRequest = z.input<typeof teams.invitationRequest>;
export type MemberList = z.infer<typeof teams.memberList>;
export type CreatedInvitation = z.infer<typeof teams.createdInvitation>;
export type InvitationPreview = z.infer<typeof teams.invitationPreview>;
export type AcceptedInvitation = z.infer<typeof teams.acceptedInvitation>;

// ---- cells ----
export type Cell = z.infer<typeof cells.cell>;
export type CellList = z.infer<typeof cells.cellList>;

// ---- networks ----
export type Network = z.infer<typeof networks.network>;
export type NetworkSummary = z.infer<typeof networks.networkSummary>;
export type NetworkList = z.infer<typeof networks.networkList>;
export type NetworkSort = (typeof networks.networkSorts)[number];
export type CreateNetworkRequest = z.input<typeof networks.createNetworkRequest>;
export type PatchNetworkRequest = z.input<typeof networks.patchNetworkRequest>;
export type DuplicateNetworkRequest = z.input<typeof networks.duplicateNetworkRequest>;

// ---- derivations ----
export type RevisionResults = revisions.RevisionResults;
export type Revision = z.infer<typeof revisions.revision>;
export type RevisionList = z.infer<typeof revisions.revisionList>;
export type SolveJob = z.infer<typeof revisions.solveJob>;
export type SolveJobAnswer = z.infer<typeof revisions.solveJobAnswer>;
export type RevisionComparison = z.infer<typeof revisions.revisionComparison>;

// ---- review ----
export type NoteAnchor = z.infer<typeof reviews.noteAnchor>;
export type Comment = z.infer<typeof reviews.comment>;
export type Reply = z.infer<typeof reviews.reply>;
export type CommentList = z.infer<typeof reviews.commentList>;
export type CommentRequest = z.input<typeof reviews.commentRequest>;
export type EditCommentRequest = z.input<typeof reviews.editCommentRequest>;
export type VerdictRequest = z.input<typeof reviews.verdictRequest>;
export type VerdictEntry = z.infer<typeof reviews.verdictEntry>;
export type VerdictHistory = z.infer<typeof reviews.verdictHistory>;
export type VerdictGiven = z.infer<typeof reviews.verdictGiven>;
export type ReviewQueuePage = z.infer<typeof reviews.reviewQueuePage>;

// ---- sharing ----
export type ShareRequest = z.input<typeof shares.shareRequest>;
export type CreatedShare = z.infer<typeof shares.createdShare>;
export type Share = z.infer<typeof shares.share>;
export type ShareList = z.infer<typeof shares.shareList>;
export type SharedRevision = z.infer<typeof shares.sharedRevision>;

// ---- value sets and attachments ----
export type ValueSet = z.infer<typeof valueSets.valueSet>;
export type ValueSetList = z.infer<typeof valueSets.valueSetList>;
export type SaveValueSetRequest = z.input<typeof valueSets.saveValueSetRequest>;
export type Attachment = z.infer<typeof attachments.attachment>;
export type AttachmentList = z.infer<typeof attachments.attachmentList>;

// The three results the client shows; rthFromVocIsc is Voc/Isc, the cross-check of rth.
export type ResultName = Exclude<EngineResultName, "rthFromVocIsc">;
// The marks of the check badge.
export type CheckMark = Exclude<keyof RevisionResults["checks"], "details">;
