import { Router } from "express";
import { openApiDocument } from "../lib/openapi.js";

// The API's own description, open to anyone like the reference page that reads it.
export function openApiRouter(): Router {
  const router = Router();
  router.get("/", (_req, res) => {
    res.json(openApiDocument());
  });
  return router;
}
