import { Router } from "express";
import {
  createNetworkRequest as createBody,
  duplicateNetworkRequest as duplicateBody,
  importFields,
  networkListQuery as listQuery,
  patchNetworkRequest as patchBody,
} from "../../shared/api/networks.js";
import { signedInUser } from "../auth/session.js";
import { requireTeamRole } from "../domain/access.js";
import {
  createNetwork,
  deleteNetwork,
  duplicateNetwork,
  getNetwork,
  importNetwork,
  listNetworks,
  networkIdForSlug,
  updateNetwork,
} from "../domain/networks.js";
import { readCircuitAndText } from "../domain/reading.js";
import type { Services } from "../domain/services.js";
import { notFound } from "../domain/errors.js";
import { readUpload } from "../lib/uploads.js";
import { idParam, parseBody, parseQuery } from "../lib/validate.js";

export function networksRouter(services: Services): Router {
  const router = Router();
  const { db } = services;

  router.get("/teams/:teamId/networks", async (req, res) => {
    const user = signedInUser(res);
    const teamId = idParam(req.params.teamId, "That team");
    const query = parseQuery(listQuery, req.query);
    res.json(await listNetworks(db, user.id, teamId, { ...query, q: query.q || undefined }));
  });

  router.post("/teams/:teamId/networks", async (req, res) => {
    const user = signedInUser(res);
    const teamId = idParam(req.params.teamId, "That team");
    const body = parseBody(createBody, req.body);
    res.status(201).json(await createNetwork(db, user.id, teamId, { ...body, ...(await readCircuitAndText(services, body)) }));
  });

  router.post("/teams/:teamId/networks/import", async (req, res) => {
    const user = signedInUser(res);
    const teamId = idParam(req.params.teamId, "That team");
    // Access first: a file is only read into memory for someone allowed to import it.
    await requireTeamRole(db, user.id, teamId, "editor");
    const { file, fields } = await readUpload(req, res, services.settings.limits.importBytes);
    // A title given with the file obeys the same rule as any title; without one, the file name stands in.
    const { title: given } = parseBody(importFields, { title: fields.title || undefined });
    res.status(201).json(await importNetwork(services, user.id, teamId, file, given));
  });

  router.get("/networks/by-slug/:slug", async (req, res) => {
    const user = signedInUser(res);
    const slug = req.params.slug;
    if (!/^[a-z0-9-]{1,80}$/.test(slug)) throw notFound("That network");
    res.json(await getNetwork(db, user.id, await networkIdForSlug(db, user.id, slug)));
  });

  router.get("/networks/:networkId", async (req, res) => {
    const user = signedInUser(res);
    res.json(await getNetwork(db, user.id, idParam(req.params.networkId, "That network")));
  });

  router.patch("/networks/:networkId", async (req, res) => {
    const user = signedInUser(res);
    const networkId = idParam(req.params.networkId, "That network");
    const body = parseBody(patchBody, req.body);
    const patch = { ...body, ...(body.circuit !== undefined || body.netlist !== undefined ? await readCircuitAndText(services, body) : { circuit: undefined }) };
    res.json(await updateNetwork(db, user.id, networkId, patch));
  });

  router.delete("/networks/:networkId", async (req, res) => {
    const user = signedInUser(res);
    await deleteNetwork(db, user.id, idParam(req.params.networkId, "That network"));
    res.status(204).end();
  });

  router.post("/networks/:networkId/duplicate", async (req, res) => {
    const user = signedInUser(res);
    const networkId = idParam(req.params.networkId, "That network");
    const body = parseBody(duplicateBody, req.body);
    res.status(201).json(await duplicateNetwork(db, user.id, networkId, body.title));
  });

  return router;
}
