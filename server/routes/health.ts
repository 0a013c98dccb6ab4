import { Router } from "express";
import type pg from "pg";

// Answers within about two seconds whatever the database does, so monitors never hang.
export function healthRouter(pool: pg.Pool): Router {
  const router = Router();
  router.get("/", async (_req, res) => {
    const up = await databaseIsUp(pool, 2_000);
    res.status(up ? 200 : 503).json({ ok: up, db: up ? "up" : "down" });
  });
  return router;
}

async function databaseIsUp(pool: pg.Pool, timeoutMs: number): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<boolean>((resolve) => {
    timer = setTimeout(() => resolve(false), timeoutMs);
  });
  const probe = pool.query("select 1").then(() => true, () => false);
  try {
    return await Promise.race([probe, timeout]);
  } finally {
    clearTimeout(timer);
  }
}
