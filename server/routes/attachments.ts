import { Router } from "express";
import { signedInUser } from "../auth/session.js";
import { requireNetworkRole } from "../domain/access.js";
import { addAttachment, attachmentContent, attachmentTypes, deleteAttachment, listAttachments } from "../domain/attachments.js";
import type { Services } from "../domain/services.js";
import { readUpload } from "../lib/uploads.js";
import { idParam } from "../lib/validate.js";

export function attachmentsRouter(services: Services): Router {
  const router = Router();
  const { db } = services;
  const path = "/networks/:networkId/attachments";

  router.post(path, async (req, res) => {
    const user = signedInUser(res);
    const networkId = idParam(req.params.networkId, "That network");
    // Access first: a file is only read into memory for someone allowed to attach it.
    await requireNetworkRole(db, user.id, networkId, "editor");
    const { file } = await readUpload(req, res, services.settings.limits.attachmentBytes);
    res.status(201).json(await addAttachment(db, user.id, networkId, file));
  });

  router.get(path, async (req, res) => {
    const user = signedInUser(res);
    const list = await listAttachments(db, user.id, idParam(req.params.networkId, "That network"));
    // The limits travel with the list, so the page states them before anyone tries an upload.
    res.json({ attachments: list, limits: { maxBytes: services.settings.limits.attachmentBytes, types: attachmentTypes } });
  });

  router.get(`${path}/:attachmentId`, async (req, res) => {
    const user = signedInUser(res);
    const networkId = idParam(req.params.networkId, "That network");
    const file = await attachmentContent(db, user.id, networkId, idParam(req.params.attachmentId, "That attachment"));
    // Always a download with the sniffed type (set after attachment(), which guesses from the name);
    // the sandbox keeps a crafted PDF from running as our page.
    res.attachment(file.filename);
    res.set({
      "Content-Type": file.contentType,
      "Content-Length": String(file.content.length),
      "Content-Security-Policy": "sandbox; default-src 'none'",
      "Cache-Control": "private, no-cache",
    });
    res.end(file.content);
  });

  router.delete(`${path}/:attachmentId`, async (req, res) => {
    const user = signedInUser(res);
    const networkId = idParam(req.params.networkId, "That network");
    await deleteAttachment(db, user.id, networkId, idParam(req.params.attachmentId, "That attachment"));
    res.status(204).end();
  });

  return router;
}
