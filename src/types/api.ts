// Shapes of the server's JSON as the client reads them. The server owns them; the client
// normalises what it receives in one place per resource (see features/*/api).
import type { EngineDiagnostic, Element, NetworkInput } from "@/lib/engine-netlist";

export type Role = "owner" | "editor" | "reviewer" | "viewer";
export type Verdict = "open" | "approved" | "needs_changes";
export type Diagnostic = EngineDiagnostic;

export interface User {
  id: string;
  email: string;
  name: string;
  emailVerified?: boolean;
}

export interface TeamMembership {
  id: string;
  name: string;
  role: Role;
  personal?: boolean;
}

export interface AccountSettings {
  reviewMail: boolean;
}

export interface Me {
  user: User;
  teams: TeamMembership[];
  settings?: AccountSettings;
}

/** The engine's interchange format (issue 3), exactly as stored. */
export type Circuit = NetworkInput;
export type CircuitElement = Element;

export interface NetworkSummary {
  id: string;
  slug: string;
  title: string;
  author: string | null;
  lastRevision: number | null;
  verdict: Verdict | null;
  updatedAt: string;
}

export interface NetworkPage {
  items: NetworkSummary[];
  total: number;
  page: number;
  pageSize: number;
}

export interface Network {
  id: string;
  teamId: string;
  slug: string;
  title: string;
  description: string;
  circuit: Circuit;
  /** The netlist exactly as typed; null for a network made from JSON. */
  netlist: string | null;
  quantities: Record<string, string>;
  author: string | null;
  authorId: string | null;
  createdAt: string;
  updatedAt: string;
  role: Role | null;
  latestRevision: number | null;
}

export interface RevisionSummary {
  k: number;
  createdAt: string;
  author: string | null;
  verdict: Verdict | null;
  permalink: string | null;
  summary: { vth: string | null; rth: string | null; isc: string | null };
}

export interface Step {
  id: string;
  ordinal: number;
  kind: string;
  title: string;
  explanation: string;
  tex: string;
  data: unknown;
}

export interface NoteAnchor {
  part: "explanation" | "formula";
  text: string;
  start?: number;
}

export interface Stamp {
  by: string | null;
  at: string;
}

export interface Comment {
  id: string;
  stepId: string;
  parentId: string | null;
  body: string;
  deleted: boolean;
  author: string | null;
  authorId: string | null;
  createdAt: string;
  updatedAt: string;
  anchor: NoteAnchor | null;
  /** On a thread's first note: resolved (who, when), and the last reopening. */
  resolved: Stamp | null;
  reopened: Stamp | null;
}

/** A revision's review state, derived on the server from its verdict history. */
export interface ReviewState {
  verdict: Verdict;
  by: string | null;
  at: string | null;
  approvals: number;
  requiredApprovals: number;
}

export interface VerdictEntry {
  id: string;
  k: number;
  /** "open" is a withdrawal of the entry in `withdraws`. */
  verdict: Verdict;
  by: string | null;
  byId: string | null;
  role: Role | null;
  note: string | null;
  at: string;
  withdraws: string | null;
  withdrawnAt: string | null;
}

export interface ReviewQueueItem {
  networkId: string;
  title: string;
  teamName: string;
  k: number;
  author: string | null;
  createdAt: string;
  state: ReviewState;
  openNotes: number;
}

export interface ReviewQueuePage {
  items: ReviewQueueItem[];
  total: number;
  page: number;
  pageSize: number;
}

/** One exact result in the forms the client shows: canonical N/D and compact, as infix and TeX. */
export interface ResultForm {
  infix: string;
  tex: string;
  compact: string;
  compactTex: string;
}

export type ResultName = "vth" | "isc" | "rth";

export type CheckMark = "testSource" | "vocIsc" | "numeric" | "exactPoint";

/** What one mark of the check badge did and found (engine CheckDetail). */
export interface CheckDetail {
  agree: boolean | null;
  method: string;
  outcome: string;
  points: number;
  relativeError: number | null;
}

/** The check badge; details is null for revisions solved before each check said what it did. */
export interface ResultChecks {
  testSource: boolean | null;
  vocIsc: boolean | null;
  numeric: boolean | null;
  exactPoint: boolean | null;
  details: Record<CheckMark, CheckDetail> | null;
}

export interface Results {
  vth: ResultForm | null;
  isc: ResultForm | null;
  rth: ResultForm | null;
  rthFromVocIsc: ResultForm | null;
  agree: boolean | null;
  statements: { code: string; message: string }[];
  checks: ResultChecks;
  /** Quantity per symbol (resistance, voltage, dimensionless, ...), null when none could be inferred. */
  quantities: Record<string, string | null>;
  dimensionChecks: Partial<Record<ResultName, { status: string; message: string; found: string | null }>>;
}

export interface Revision {
  networkId: string;
  slug: string;
  title: string;
  k: number;
  permalink: string | null;
  createdAt: string;
  author: string | null;
  authorId: string | null;
  circuit: Circuit;
  results: Results;
  diagnostics: Diagnostic[];
  steps: Step[];
  verdict: ReviewState;
  /** The latest earlier revision that reads as approved. */
  approvedBefore: { k: number; by: string | null; at: string | null } | null;
  /** Open note threads; null where notes are not shown (the shared view). */
  openNotes: number | null;
}

export interface ShareLink {
  id: string;
  /** Only known right after creation: the server keeps a hash, never the token. */
  token: string | null;
  url: string | null;
  k: number;
  status: string;
  createdBy: string | null;
  createdAt: string;
  expiresAt: string | null;
  revokedAt: string | null;
}

/** Named numbers for a network's symbols, as typed in Values. */
export interface ValueSet {
  id: string;
  name: string;
  values: Record<string, string>;
  createdAt: string;
  updatedAt: string;
}

export interface Attachment {
  id: string;
  filename: string;
  contentType: string;
  size: number;
  uploadedBy: string | null;
  createdAt: string;
}
