// Attachments on a network (datasheets, scope captures): PDF, PNG, JPEG, stored in PostgreSQL.
import { and, asc, eq } from "drizzle-orm";
import type { Database } from "../db/client.js";
import { attachments, users } from "../db/schema.js";
import { UnsupportedType, notFound } from "./errors.js";
import { withoutControls } from "../lib/validate.js";
import { requireNetworkRole } from "./access.js";

// The type is read from the file's first bytes (its signature), not trusted from the client.
const signatures: { type: string; bytes: number[]; extensions: string[] }[] = [
  { type: "application/pdf", bytes: [0x25, 0x50, 0x44, 0x46, 0x2d], extensions: [".pdf"] }, // "%PDF-"
  { type: "image/png", bytes: [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a], extensions: [".png"] },
  { type: "image/jpeg", bytes: [0xff, 0xd8, 0xff], extensions: [".jpg", ".jpeg"] },
];

export const attachmentTypes = signatures.map((s) => s.type);

function sniffContentType(content: Buffer): string | null {
  const match = signatures.find((s) => content.length >= s.bytes.length && s.bytes.every((b, i) => content[i] === b));
  return match?.type ?? null;
}

/**
 * Keeps the name a person gave the file, minus anything that could break a header or a path or make
 * it read as something else (controls, bidi overrides), ending in the extension of its sniffed type.
 */
function cleanFilename(name: string, contentType: string): string {
  const { extensions } = signatures.find((s) => s.type === contentType)!;
  const base = withoutControls((name.split(/[\\/]/).pop() ?? "").replace(/"/g, ""));
  const dot = base.lastIndexOf(".");
  const own = dot > 0 ? base.slice(dot).toLowerCase() : "";
  const stem = (dot > 0 ? base.slice(0, dot) : base).slice(0, 190).trim() || "attachment";
  return `${stem}${extensions.includes(own) ? own : extensions[0]}`;
}

type AttachmentRow = typeof attachments.$inferSelect;

function view(row: Omit<AttachmentRow, "content">, uploaderName: string | null) {
  return {
    id: row.id,
    networkId: row.networkId,
    filename: row.filename,
    contentType: row.contentType,
    size: row.size,
    uploadedBy: row.uploadedBy && uploaderName ? { id: row.uploadedBy, name: uploaderName } : null,
    createdAt: row.createdAt.toISOString(),
  };
}

export async function addAttachment(
  db: Database,
  userId: string,
  networkId: string,
  file: { originalname: string; mimetype: string; buffer: Buffer },
) {
  await requireNetworkRole(db, userId, networkId, "editor");
  const contentType = sniffContentType(file.buffer);
  if (!contentType) {
    throw new UnsupportedType("unsupported_type", "Attachments are PDF, PNG or JPEG files.", { fields: { file: "not a PDF, PNG or JPEG file" } });
  }
  const declared = file.mimetype.toLowerCase();
  if (declared !== contentType && declared !== "application/octet-stream") {
    throw new UnsupportedType("type_mismatch", `The file says it is ${declared} but its content is ${contentType}.`, { fields: { file: "content does not match its type" } });
  }
  const [row] = await db
    .insert(attachments)
    .values({ networkId, filename: cleanFilename(file.originalname, contentType), contentType, size: file.buffer.length, content: file.buffer, uploadedBy: userId })
    .returning();
  const [uploader] = await db.select({ name: users.name }).from(users).where(eq(users.id, userId));
  return view(row, uploader?.name ?? null);
}

export async function listAttachments(db: Database, userId: string, networkId: string) {
  await requireNetworkRole(db, userId, networkId, "viewer");
  const rows = await db
    .select({
      id: attachments.id,
      networkId: attachments.networkId,
      filename: attachments.filename,
      contentType: attachments.contentType,
      size: attachments.size,
      uploadedBy: attachments.uploadedBy,
      createdAt: attachments.createdAt,
      uploaderName: users.name,
    })
    .from(attachments)
    .leftJoin(users, eq(users.id, attachments.uploadedBy))
    .where(eq(attachments.networkId, networkId))
    .orderBy(asc(attachments.createdAt));
  return rows.map((row) => view(row, row.uploaderName));
}

export async function attachmentContent(db: Database, userId: string, networkId: string, attachmentId: string) {
  await requireNetworkRole(db, userId, networkId, "viewer");
  const [row] = await db.select().from(attachments).where(and(eq(attachments.id, attachmentId), eq(attachments.networkId, networkId)));
  if (!row) throw notFound("That attachment");
  return { filename: row.filename, contentType: row.contentType, content: row.content };
}

export async function deleteAttachment(db: Database, userId: string, networkId: string, attachmentId: string): Promise<void> {
  await requireNetworkRole(db, userId, networkId, "editor");
  const deleted = await db
    .delete(attachments)
    .where(and(eq(attachments.id, attachmentId), eq(attachments.networkId, networkId)))
    .returning({ id: attachments.id });
  if (deleted.length === 0) throw notFound("That attachment");
}
