import {
  boolean,
  customType,
  foreignKey,
  index,
  integer,
  jsonb,
  pgTable,
  primaryKey,
  text,
  timestamp,
  unique,
  uuid,
} from "drizzle-orm/pg-core";
import { tokenScopes } from "../../shared/api/tokens.js";

// Attachments live in PostgreSQL, so one backup holds everything.
const bytea = customType<{ data: Buffer; driverData: Buffer }>({
  dataType: () => "bytea",
});

const createdAt = () => timestamp("created_at", { withTimezone: true }).notNull().defaultNow();

export const roles = ["owner", "editor", "reviewer", "viewer"] as const;
export type Role = (typeof roles)[number];

export const verdicts = ["open", "approved", "needs_changes"] as const;
export type Verdict = (typeof verdicts)[number];

// ---- accounts ----

export const users = pgTable("users", {
  id: text("id").primaryKey(),
  email: text("email").notNull().unique(),
  name: text("name").notNull(),
  // null: no password set, so password sign-in is impossible for this row.
  passwordHash: text("password_hash"),
  emailVerifiedAt: timestamp("email_verified_at", { withTimezone: true }),
  // Account setting: mails about notes and verdicts on the revisions one takes part in.
  reviewMail: boolean("review_mail").notNull().default(true),
  createdAt: createdAt(),
});

// lucia's session table: id, user_id, expires_at (timestamptz).
export const sessions = pgTable(
  "sessions",
  {
    id: text("id").primaryKey(),
    userId: text("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    expiresAt: timestamp("expires_at", { withTimezone: true, mode: "date" }).notNull(),
  },
  (table) => [index("sessions_user_id_idx").on(table.userId)],
);

export const emailTokenPurposes = ["verify_email", "reset_password"] as const;
export type EmailTokenPurpose = (typeof emailTokenPurposes)[number];

// Single-use links sent by e-mail; only the SHA-256 of the token is stored.
export const emailTokens = pgTable(
  "email_tokens",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: text("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    purpose: text("purpose", { enum: emailTokenPurposes }).notNull(),
    tokenHash: text("token_hash").notNull().unique(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    usedAt: timestamp("used_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (table) => [index("email_tokens_user_id_idx").on(table.userId)],
);

// ---- teams ----

export const teams = pgTable("teams", {
  id: uuid("id").primaryKey().defaultRandom(),
  name: text("name").notNull(),
  // Set on the one personal team every user gets at sign-up; that team cannot be deleted.
  personalUserId: text("personal_user_id").unique().references(() => users.id, { onDelete: "cascade" }),
  // Approvals (by people other than the revision's author) before a revision reads as approved.
  requiredApprovals: integer("required_approvals").notNull().default(1),
  createdAt: createdAt(),
});

export const teamMembers = pgTable(
  "team_members",
  {
    teamId: uuid("team_id").notNull().references(() => teams.id, { onDelete: "cascade" }),
    userId: text("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    role: text("role", { enum: roles }).notNull(),
  },
  (table) => [primaryKey({ columns: [table.teamId, table.userId] }), index("team_members_user_id_idx").on(table.userId)],
);

export const invitations = pgTable(
  "invitations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id").notNull().references(() => teams.id, { onDelete: "cascade" }),
    email: text("email").notNull(),
    role: text("role", { enum: roles }).notNull(),
    tokenHash: text("token_hash").notNull().unique(),
    invitedBy: text("invited_by").references(() => users.id, { onDelete: "set null" }),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    acceptedAt: timestamp("accepted_at", { withTimezone: true }),
    acceptedBy: text("accepted_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (table) => [index("invitations_team_id_idx").on(table.teamId)],
);

// ---- networks and derivation revisions ----

export const networks = pgTable(
  "networks",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id").notNull().references(() => teams.id, { onDelete: "cascade" }),
    slug: text("slug").notNull().unique(),
    title: text("title").notNull(),
    description: text("description").notNull().default(""),
    // The engine's JSON interchange format: port and declared symbol quantities included.
    circuit: jsonb("circuit").notNull(),
    // The Portfold netlist exactly as typed (comments, blank lines, order); null for networks made from JSON.
    netlist: text("netlist"),
    authorId: text("author_id").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [index("networks_team_id_idx").on(table.teamId)],
);

// Immutable once written: a solve inserts one row here and its steps, nothing updates them.
export const revisions = pgTable(
  "revisions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    networkId: uuid("network_id").notNull().references(() => networks.id, { onDelete: "cascade" }),
    number: integer("number").notNull(),
    // The network as the engine read it (defaults filled in), so a revision never depends on later edits.
    circuit: jsonb("circuit").notNull(),
    results: jsonb("results").notNull(),
    diagnostics: jsonb("diagnostics").notNull().default([]),
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (table) => [unique("revisions_network_number_unique").on(table.networkId, table.number)],
);

export const revisionSteps = pgTable(
  "revision_steps",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    revisionId: uuid("revision_id").notNull().references(() => revisions.id, { onDelete: "cascade" }),
    ordinal: integer("ordinal").notNull(),
    // The engine's own step id, stable for the same input; comments anchor to it.
    stepKey: text("step_key").notNull(),
    kind: text("kind").notNull(),
    title: text("title").notNull(),
    explanation: text("explanation").notNull(),
    tex: text("tex").notNull(),
    data: jsonb("data").notNull(),
  },
  (table) => [
    unique("revision_steps_ordinal_unique").on(table.revisionId, table.ordinal),
    unique("revision_steps_key_unique").on(table.revisionId, table.stepKey),
  ],
);

// ---- review ----

// A history, never updated: each person's latest row is their standing verdict ("open" = withdrawn),
// and the revision's state is derived from those (server/domain/verdicts.ts).
export const revisionVerdicts = pgTable(
  "revision_verdicts",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    revisionId: uuid("revision_id").notNull().references(() => revisions.id, { onDelete: "cascade" }),
    verdict: text("verdict", { enum: verdicts }).notNull(),
    userId: text("user_id").references(() => users.id, { onDelete: "set null" }),
    // The giver's role in the team when it was given (null on rows older than this column).
    role: text("role", { enum: roles }),
    note: text("note"),
    // On a withdrawal ("open"): the verdict it takes back.
    withdrawsId: uuid("withdraws_id"),
    createdAt: createdAt(),
  },
  (table) => [
    index("revision_verdicts_revision_idx").on(table.revisionId, table.createdAt),
    foreignKey({ name: "revision_verdicts_withdraws_fk", columns: [table.withdrawsId], foreignColumns: [table.id] }).onDelete("cascade"),
  ],
);

// Where a note points inside its step: a highlighted stretch of the explanation or a term of the formula.
export interface NoteAnchor {
  part: "explanation" | "formula";
  text: string;
  start?: number;
}

export const comments = pgTable(
  "comments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    revisionId: uuid("revision_id").notNull(),
    stepKey: text("step_key").notNull(),
    // Replies point at the thread's first comment; threads are one level deep.
    parentId: uuid("parent_id"),
    authorId: text("author_id").references(() => users.id, { onDelete: "set null" }),
    body: text("body").notNull(),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
    // Deleted comments keep their row so the replies under them stay in place.
    deletedAt: timestamp("deleted_at", { withTimezone: true }),
    anchor: jsonb("anchor").$type<NoteAnchor>(),
    // On a thread's first comment: the thread's state, with who changed it last and when.
    resolvedAt: timestamp("resolved_at", { withTimezone: true }),
    resolvedBy: text("resolved_by").references(() => users.id, { onDelete: "set null" }),
    reopenedAt: timestamp("reopened_at", { withTimezone: true }),
    reopenedBy: text("reopened_by").references(() => users.id, { onDelete: "set null" }),
  },
  (table) => [
    foreignKey({
      name: "comments_step_fk",
      columns: [table.revisionId, table.stepKey],
      foreignColumns: [revisionSteps.revisionId, revisionSteps.stepKey],
    }).onDelete("cascade"),
    foreignKey({ name: "comments_parent_fk", columns: [table.parentId], foreignColumns: [table.id] }).onDelete("cascade"),
    index("comments_revision_idx").on(table.revisionId),
  ],
);

// ---- sharing ----

export const shareLinks = pgTable(
  "share_links",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    revisionId: uuid("revision_id").notNull().references(() => revisions.id, { onDelete: "cascade" }),
    // SHA-256 of the token; the token itself is shown once, to its creator.
    tokenHash: text("token_hash").notNull().unique(),
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    expiresAt: timestamp("expires_at", { withTimezone: true }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
  },
  (table) => [index("share_links_revision_idx").on(table.revisionId)],
);

// Named sets of numbers for a network's symbols, as typed in the Values panel (e.g. "nominal", "worst case").
export const valueSets = pgTable(
  "value_sets",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    networkId: uuid("network_id").notNull().references(() => networks.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    values: jsonb("values").$type<Record<string, string>>().notNull(),
    createdBy: text("created_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [unique("value_sets_network_name_unique").on(table.networkId, table.name)],
);

// ---- uploads ----

export const attachments = pgTable(
  "attachments",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    networkId: uuid("network_id").notNull().references(() => networks.id, { onDelete: "cascade" }),
    filename: text("filename").notNull(),
    contentType: text("content_type").notNull(),
    size: integer("size").notNull(),
    content: bytea("content").notNull(),
    uploadedBy: text("uploaded_by").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
  },
  (table) => [index("attachments_network_idx").on(table.networkId)],
);

// ---- development mail capture ----

// Every message the local SMTP capture server receives; unused when SMTP_HOST points elsewhere.
export const mailMessages = pgTable("mail_messages", {
  id: uuid("id").primaryKey().defaultRandom(),
  envelopeFrom: text("envelope_from").notNull(),
  envelopeTo: jsonb("envelope_to").$type<string[]>().notNull(),
  subject: text("subject").notNull(),
  text: text("text").notNull(),
  html: text("html"),
  receivedAt: timestamp("received_at", { withTimezone: true }).notNull().defaultNow(),
});

// ---- solving ----

// Finished derivations by a canonical hash of (engine, circuit with its port, options): a network
// solved twice is derived once, whichever server process asks, and restarts keep the entries.
export const solveCache = pgTable(
  "solve_cache",
  {
    key: text("key").primaryKey(),
    derivation: jsonb("derivation").notNull(),
    hits: integer("hits").notNull().default(0),
    createdAt: createdAt(),
    lastUsedAt: timestamp("last_used_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [index("solve_cache_last_used_idx").on(table.lastUsedAt)],
);

export const solveJobStatuses = ["queued", "solving", "done", "failed"] as const;
export type SolveJobStatus = (typeof solveJobStatuses)[number];

// A solve that outlived the request's wait: the client polls this row (any server can answer).
export const solveJobs = pgTable(
  "solve_jobs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    networkId: uuid("network_id").notNull().references(() => networks.id, { onDelete: "cascade" }),
    requestedBy: text("requested_by").references(() => users.id, { onDelete: "set null" }),
    status: text("status", { enum: solveJobStatuses }).notNull(),
    cacheHit: boolean("cache_hit"),
    revisionNumber: integer("revision_number"),
    // The error the synchronous answer would have had: { status, code, message, cap?, diagnostics? }.
    error: jsonb("error"),
    createdAt: createdAt(),
    startedAt: timestamp("started_at", { withTimezone: true }),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
    // The server process (INSTANCE_NAME) running the solve: when it starts again, its unfinished jobs are failed.
    runner: text("runner"),
  },
  (table) => [index("solve_jobs_network_idx").on(table.networkId), index("solve_jobs_finished_idx").on(table.finishedAt)],
);

// ---- cells ----

// A team's own cells: reusable blocks its networks place by id beside the built-in ones.
export const teamCells = pgTable(
  "cells",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    teamId: uuid("team_id").notNull().references(() => teams.id, { onDelete: "cascade" }),
    // The cell id networks use in their instances (e.g. "gain-stage"); one per team.
    slug: text("slug").notNull(),
    title: text("title").notNull(),
    // The engine's cell definition (id, title, terminals, symbols, elements, optional).
    definition: jsonb("definition").notNull(),
    authorId: text("author_id").references(() => users.id, { onDelete: "set null" }),
    createdAt: createdAt(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [unique("cells_team_slug_unique").on(table.teamId, table.slug)],
);

// ---- personal API tokens ----

// A person's tokens for scripts: only the SHA-256 of the secret is stored; team_id null reaches every team of the person.
export const apiTokens = pgTable(
  "api_tokens",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: text("user_id").notNull().references(() => users.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    tokenHash: text("token_hash").notNull().unique(),
    // The secret's last four characters, so a person can tell tokens apart in the list.
    hint: text("hint").notNull(),
    scope: text("scope", { enum: tokenScopes }).notNull(),
    teamId: uuid("team_id").references(() => teams.id, { onDelete: "cascade" }),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    lastUsedAt: timestamp("last_used_at", { withTimezone: true }),
    revokedAt: timestamp("revoked_at", { withTimezone: true }),
    createdAt: createdAt(),
  },
  (table) => [index("api_tokens_user_id_idx").on(table.userId)],
);
