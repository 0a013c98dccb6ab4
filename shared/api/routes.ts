// Every route of the API once: method, path, who may call it, what it takes and what it answers.
// The server checks its mounted routes against this table and serves it as OpenAPI 3.1; tokens reach the routes marked so.
import type { z } from "zod";
import * as accounts from "./accounts.js";
import * as attachments from "./attachments.js";
import * as cells from "./cells.js";
import { revisionState } from "./common.js";
import * as devMail from "./dev-mail.js";
import * as networks from "./networks.js";
import * as operations from "./operations.js";
import * as reviews from "./reviews.js";
import * as revisions from "./revisions.js";
import * as shares from "./shares.js";
import * as teams from "./teams.js";
import * as tokens from "./tokens.js";
import * as valueSets from "./value-sets.js";

type Method = "GET" | "POST" | "PATCH" | "PUT" | "DELETE";

export interface Endpoint {
  method: Method;
  // Express style, with the /api prefix: /api/networks/:networkId
  path: string;
  tag: string;
  summary: string;
  // anyone; a signed-in person (session cookie, or a token where `token` says so)
  access: "public" | "signed-in";
  // The least token scope that reaches the route; absent: a browser session only.
  token?: tokens.TokenScope;
  body?: z.ZodType;
  query?: z.ZodType;
  // multipart/form-data with one `file` field (and an optional `title` on import).
  upload?: boolean;
  // status → answer body (null: no body, or not JSON)
  answers: Record<number, z.ZodType | null | { contentType: string }>;
}

const e = (endpoint: Endpoint) => endpoint;

export const endpoints: Endpoint[] = [
  // ---- accounts ----
  e({ method: "POST", path: "/api/auth/signup", tag: "accounts", summary: "Create an account and sign in; sends a verification mail", access: "public", body: accounts.signupRequest, answers: { 201: accounts.userAnswer } }),
  e({ method: "POST", path: "/api/auth/login", tag: "accounts", summary: "Sign in", access: "public", body: accounts.loginRequest, answers: { 200: accounts.userAnswer } }),
  e({ method: "POST", path: "/api/auth/logout", tag: "accounts", summary: "Sign out", access: "public", answers: { 204: null } }),
  e({ method: "POST", path: "/api/auth/verify-email", tag: "accounts", summary: "Confirm the e-mail address with the mailed link", access: "public", body: accounts.emailLinkRequest, answers: { 200: accounts.userAnswer } }),
  e({ method: "POST", path: "/api/auth/verify-email/resend", tag: "accounts", summary: "Send the verification mail again", access: "signed-in", answers: { 202: accounts.sentAnswer } }),
  e({ method: "POST", path: "/api/auth/password-reset", tag: "accounts", summary: "Mail a password-reset link", access: "public", body: accounts.passwordResetRequest, answers: { 202: accounts.sentAnswer } }),
  e({ method: "POST", path: "/api/auth/password-reset/confirm", tag: "accounts", summary: "Set a new password with the mailed link", access: "public", body: accounts.passwordResetConfirmRequest, answers: { 200: accounts.userAnswer } }),
  e({ method: "GET", path: "/api/me", tag: "accounts", summary: "The signed-in person, their teams and settings", access: "signed-in", answers: { 200: accounts.me } }),
  e({ method: "PATCH", path: "/api/me/settings", tag: "accounts", summary: "Turn review mail on or off", access: "signed-in", body: accounts.settingsRequest, answers: { 200: accounts.settingsAnswer } }),
  // ---- API tokens ----
  e({ method: "GET", path: "/api/account/tokens", tag: "tokens", summary: "Your API tokens (never their secrets)", access: "signed-in", answers: { 200: tokens.tokenList } }),
  e({ method: "POST", path: "/api/account/tokens", tag: "tokens", summary: "Create an API token; the answer holds its secret, shown once", access: "signed-in", body: tokens.createTokenRequest, answers: { 201: tokens.createdToken } }),
  e({ method: "DELETE", path: "/api/account/tokens/:tokenId", tag: "tokens", summary: "Revoke an API token", access: "signed-in", answers: { 204: null } }),
  e({ method: "GET", path: "/api/account/tokens/current", tag: "tokens", summary: "The token this request carries and the teams it reaches", access: "signed-in", token: "read", answers: { 200: tokens.currentToken } }),
  // ---- teams ----
  e({ method: "POST", path: "/api/teams", tag: "teams", summary: "Create a team", access: "signed-in", body: teams.teamRequest, answers: { 201: teams.team } }),
  e({ method: "GET", path: "/api/teams/:teamId", tag: "teams", summary: "A team", access: "signed-in", token: "read", answers: { 200: teams.team } }),
  e({ method: "PATCH", path: "/api/teams/:teamId", tag: "teams", summary: "Rename a team or set its required approvals (owner)", access: "signed-in", body: teams.teamChangesRequest, answers: { 200: teams.team } }),
  e({ method: "DELETE", path: "/api/teams/:teamId", tag: "teams", summary: "Delete a team (owner)", access: "signed-in", answers: { 204: null } }),
  e({ method: "GET", path: "/api/teams/:teamId/members", tag: "teams", summary: "The team's members", access: "signed-in", token: "read", answers: { 200: teams.memberList } }),
  e({ method: "PATCH", path: "/api/teams/:teamId/members/:userId", tag: "teams", summary: "Change a member's role (owner)", access: "signed-in", body: teams.roleRequest, answers: { 200: teams.memberList } }),
  e({ method: "DELETE", path: "/api/teams/:teamId/members/:userId", tag: "teams", summary: "Remove a member (owner), or leave", access: "signed-in", answers: { 204: null } }),
  e({ method: "POST", path: "/api/teams/:teamId/invitations", tag: "teams", summary: "Invite by e-mail (owner)", access: "signed-in", body: teams.invitationRequest, answers: { 201: teams.createdInvitation } }),
  e({ method: "GET", path: "/api/teams/:teamId/invitations", tag: "teams", summary: "Pending invitations (owner)", access: "signed-in", answers: { 200: teams.invitationList } }),
  e({ method: "DELETE", path: "/api/teams/:teamId/invitations/:invitationId", tag: "teams", summary: "Revoke an invitation (owner)", access: "signed-in", answers: { 204: null } }),
  e({ method: "GET", path: "/api/invitations/:token", tag: "teams", summary: "What an invitation link offers", access: "public", answers: { 200: teams.invitationPreview } }),
  e({ method: "POST", path: "/api/invitations/:token/accept", tag: "teams", summary: "Accept an invitation", access: "signed-in", answers: { 200: teams.acceptedInvitation } }),
  // ---- cells ----
  e({ method: "GET", path: "/api/teams/:teamId/cells", tag: "cells", summary: "The team's own cells", access: "signed-in", token: "read", answers: { 200: cells.cellList } }),
  e({ method: "POST", path: "/api/teams/:teamId/cells", tag: "cells", summary: "Save a cell (editor)", access: "signed-in", body: cells.createCellRequest, answers: { 201: cells.cell } }),
  e({ method: "DELETE", path: "/api/teams/:teamId/cells/:cellId", tag: "cells", summary: "Delete a cell (editor)", access: "signed-in", answers: { 204: null } }),
  // ---- networks ----
  e({ method: "GET", path: "/api/teams/:teamId/networks", tag: "networks", summary: "The team's networks, searched, sorted and paged", access: "signed-in", token: "read", query: networks.networkListQuery, answers: { 200: networks.networkList } }),
  e({ method: "POST", path: "/api/teams/:teamId/networks", tag: "networks", summary: "Create a network from its circuit, its netlist text, or both (editor)", access: "signed-in", token: "solve", body: networks.createNetworkRequest, answers: { 201: networks.network } }),
  e({ method: "POST", path: "/api/teams/:teamId/networks/import", tag: "networks", summary: "Import a JSON or netlist file (editor)", access: "signed-in", token: "solve", upload: true, answers: { 201: networks.network } }),
  e({ method: "GET", path: "/api/networks/by-slug/:slug", tag: "networks", summary: "A network by its permanent slug", access: "signed-in", token: "read", answers: { 200: networks.network } }),
  e({ method: "GET", path: "/api/networks/:networkId", tag: "networks", summary: "A network", access: "signed-in", token: "read", answers: { 200: networks.network } }),
  e({ method: "PATCH", path: "/api/networks/:networkId", tag: "networks", summary: "Change a network's title, description, circuit or netlist text (editor)", access: "signed-in", token: "solve", body: networks.patchNetworkRequest, answers: { 200: networks.network } }),
  e({ method: "DELETE", path: "/api/networks/:networkId", tag: "networks", summary: "Delete a network (editor)", access: "signed-in", answers: { 204: null } }),
  e({ method: "POST", path: "/api/networks/:networkId/duplicate", tag: "networks", summary: "Copy a network (editor)", access: "signed-in", body: networks.duplicateNetworkRequest, answers: { 201: networks.network } }),
  // ---- derivations ----
  e({ method: "POST", path: "/api/networks/:networkId/solve", tag: "derivations", summary: "Solve: 201 with the revision, or 202 with a job to poll", access: "signed-in", token: "solve", query: revisions.solveQuery, answers: { 201: revisions.revision, 202: revisions.solveJobAnswer } }),
  e({ method: "GET", path: "/api/networks/:networkId/solve-jobs/:jobId", tag: "derivations", summary: "A solve job's progress", access: "signed-in", token: "read", answers: { 200: revisions.solveJob } }),
  e({ method: "GET", path: "/api/networks/:networkId/revisions", tag: "derivations", summary: "The network's revisions, newest first", access: "signed-in", token: "read", answers: { 200: revisions.revisionList } }),
  e({ method: "GET", path: "/api/networks/:networkId/revisions/:number", tag: "derivations", summary: "One revision with its steps", access: "signed-in", token: "read", answers: { 200: revisions.revision } }),
  e({ method: "GET", path: "/api/networks/:networkId/revisions/:from/compare/:to", tag: "derivations", summary: "What changed between two revisions", access: "signed-in", token: "read", answers: { 200: revisions.revisionComparison } }),
  // ---- share links ----
  e({ method: "POST", path: "/api/networks/:networkId/revisions/:number/share", tag: "sharing", summary: "Create a share link (editor)", access: "signed-in", body: shares.shareRequest, answers: { 201: shares.createdShare } }),
  e({ method: "GET", path: "/api/networks/:networkId/revisions/:number/share", tag: "sharing", summary: "The revision's share links", access: "signed-in", answers: { 200: shares.shareList } }),
  e({ method: "DELETE", path: "/api/networks/:networkId/revisions/:number/share/:shareId", tag: "sharing", summary: "Revoke a share link (editor)", access: "signed-in", answers: { 204: null } }),
  e({ method: "GET", path: "/api/share/:token", tag: "sharing", summary: "The revision behind a share link", access: "public", answers: { 200: shares.sharedRevision } }),
  e({ method: "DELETE", path: "/api/share/:token", tag: "sharing", summary: "Revoke a share link by its token (editor)", access: "signed-in", answers: { 204: null } }),
  // ---- review ----
  e({ method: "GET", path: "/api/networks/:networkId/revisions/:number/comments", tag: "review", summary: "Notes on the revision's steps", access: "signed-in", answers: { 200: reviews.commentList } }),
  e({ method: "POST", path: "/api/networks/:networkId/revisions/:number/comments", tag: "review", summary: "Note a step (reviewer)", access: "signed-in", body: reviews.commentRequest, answers: { 201: reviews.comment } }),
  e({ method: "PATCH", path: "/api/networks/:networkId/revisions/:number/comments/:commentId", tag: "review", summary: "Edit one's own note", access: "signed-in", body: reviews.editCommentRequest, answers: { 200: reviews.comment } }),
  e({ method: "DELETE", path: "/api/networks/:networkId/revisions/:number/comments/:commentId", tag: "review", summary: "Delete a note (its author or an owner)", access: "signed-in", answers: { 204: null } }),
  e({ method: "POST", path: "/api/networks/:networkId/revisions/:number/comments/:commentId/resolve", tag: "review", summary: "Resolve a note thread", access: "signed-in", answers: { 200: reviews.comment } }),
  e({ method: "POST", path: "/api/networks/:networkId/revisions/:number/comments/:commentId/reopen", tag: "review", summary: "Reopen a resolved note thread", access: "signed-in", answers: { 200: reviews.comment } }),
  e({ method: "GET", path: "/api/networks/:networkId/revisions/:number/verdicts", tag: "review", summary: "The revision's verdict history and its state", access: "signed-in", answers: { 200: reviews.verdictHistory } }),
  e({ method: "POST", path: "/api/networks/:networkId/revisions/:number/verdicts", tag: "review", summary: "Approve, or request changes with a note (reviewer; never one's own revision)", access: "signed-in", body: reviews.verdictRequest, answers: { 201: reviews.verdictGiven } }),
  e({ method: "POST", path: "/api/networks/:networkId/revisions/:number/verdicts/:verdictId/withdraw", tag: "review", summary: "Withdraw one's standing verdict", access: "signed-in", answers: { 201: reviews.verdictGiven } }),
  e({ method: "PUT", path: "/api/networks/:networkId/revisions/:number/verdict", tag: "review", summary: "Give a verdict, or withdraw one's own with \"open\" (the original route)", access: "signed-in", body: reviews.legacyVerdictRequest, answers: { 200: revisionState } }),
  e({ method: "GET", path: "/api/reviews/awaiting", tag: "review", summary: "Latest revisions awaiting your review", access: "signed-in", query: reviews.pageQuery, answers: { 200: reviews.reviewQueuePage } }),
  e({ method: "GET", path: "/api/reviews/mine", tag: "review", summary: "Your revisions in review", access: "signed-in", query: reviews.pageQuery, answers: { 200: reviews.reviewQueuePage } }),
  // ---- value sets ----
  e({ method: "GET", path: "/api/networks/:networkId/value-sets", tag: "value sets", summary: "The network's value sets", access: "signed-in", token: "read", answers: { 200: valueSets.valueSetList } }),
  e({ method: "POST", path: "/api/networks/:networkId/value-sets", tag: "value sets", summary: "Save a value set, replacing one of the same name (editor)", access: "signed-in", body: valueSets.saveValueSetRequest, answers: { 201: valueSets.valueSet } }),
  e({ method: "DELETE", path: "/api/networks/:networkId/value-sets/:setId", tag: "value sets", summary: "Delete a value set (editor)", access: "signed-in", answers: { 204: null } }),
  // ---- attachments ----
  e({ method: "POST", path: "/api/networks/:networkId/attachments", tag: "attachments", summary: "Attach a PDF, PNG or JPEG (editor)", access: "signed-in", upload: true, answers: { 201: attachments.attachment } }),
  e({ method: "GET", path: "/api/networks/:networkId/attachments", tag: "attachments", summary: "The network's attachments", access: "signed-in", answers: { 200: attachments.attachmentList } }),
  e({ method: "GET", path: "/api/networks/:networkId/attachments/:attachmentId", tag: "attachments", summary: "An attachment's file", access: "signed-in", answers: { 200: { contentType: "application/octet-stream" } } }),
  e({ method: "DELETE", path: "/api/networks/:networkId/attachments/:attachmentId", tag: "attachments", summary: "Delete an attachment (editor)", access: "signed-in", answers: { 204: null } }),
  // ---- operations ----
  e({ method: "GET", path: "/api/health", tag: "operations", summary: "Liveness and database reachability", access: "public", answers: { 200: operations.health, 503: operations.health } }),
  e({ method: "GET", path: "/api/openapi.json", tag: "operations", summary: "This document", access: "public", answers: { 200: { contentType: "application/json" } } }),
  e({ method: "GET", path: "/api/dev/mail", tag: "operations", summary: "Captured mail (development only; 404 in production)", access: "public", query: devMail.mailQuery, answers: { 200: devMail.mailList } }),
  e({ method: "GET", path: "/api/dev/mail-queue", tag: "operations", summary: "Queued and dead-lettered mail (development only; 404 in production)", access: "public", answers: { 200: devMail.mailQueue } }),
];
