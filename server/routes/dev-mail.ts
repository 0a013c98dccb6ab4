// The development mailbox: JSON for tests and tools, a plain page for people. 404 in production.
import { Router, type RequestHandler } from "express";
import { mailQuery } from "../../shared/api/dev-mail.js";
import { onLoopback } from "../auth/hosts.js";
import { capturedMail } from "../domain/mailbox.js";
import type { Services } from "../domain/services.js";
import { notFound } from "../domain/errors.js";
import { mailQueueReport } from "../mail/queue.js";
import { escapeHtml } from "../lib/html.js";
import { parseQuery } from "../lib/validate.js";

// Links become clickable after escaping; only the already-escaped text is ever emitted.
function linkify(escaped: string): string {
  return escaped.replace(/https?:\/\/[^\s<>"']+/g, (url) => `<a href="${url}">${url}</a>`);
}

// A stylesheet of its own, not an inline <style>: the Content-Security-Policy allows only our own style sheets.
const MAILBOX_CSS = `body { font: 15px/1.5 system-ui, sans-serif; max-width: 52rem; margin: 2rem auto; padding: 0 1rem; color: #1E2430; background: #FAF8F3; }
article { border-top: 1px solid #E4DED2; padding: .5rem 0 1rem; }
h2 { font-size: 1.05rem; margin: .5rem 0 0; }
.meta { color: #5b6270; margin: .2rem 0 .6rem; font-size: .85rem; }
pre { white-space: pre-wrap; font: inherit; margin: 0; }
a { color: #B5562B; }
`;

function mailboxPage(messages: Awaited<ReturnType<typeof capturedMail>>): string {
  const items = messages
    .map(
      (m) => `<article>
  <h2>${escapeHtml(m.subject || "(no subject)")}</h2>
  <p class="meta">to ${escapeHtml(m.to.join(", "))} · from ${escapeHtml(m.from)} · ${escapeHtml(m.receivedAt)}</p>
  <pre>${linkify(escapeHtml(m.text))}</pre>
</article>`,
    )
    .join("\n");
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="robots" content="noindex">
<title>Mailbox · Portfold development</title>
<link rel="stylesheet" href="/dev/mailbox.css">
</head>
<body>
<p><a href="/">← Back to Portfold</a></p>
<h1>Mailbox</h1>
<p>Every message Portfold sent while running without <code>SMTP_HOST</code>, newest first. This page does not exist in production.</p>
${items || "<p>No mail yet.</p>"}
</body>
</html>`;
}

export function devMailRouter(services: Services): Router {
  const router = Router();
  // Outside production, and then only to a loopback client naming a loopback host (never through a rebound name).
  const developmentOnly: RequestHandler = (req, _res, next) => next(services.settings.production || !onLoopback(req) ? notFound() : undefined);

  router.get("/api/dev/mail", developmentOnly, async (req, res) => {
    const query = parseQuery(mailQuery, req.query);
    res.json({ messages: await capturedMail(services.db, query) });
  });

  // Queued mail and the dead-letter queue (mail that failed its last retry); production: the SQL in README.md.
  router.get("/api/dev/mail-queue", developmentOnly, async (_req, res) => {
    res.set("Cache-Control", "no-store").json(await mailQueueReport(services.db, services.settings.mailQueue));
  });

  router.get("/dev/mailbox.css", developmentOnly, (_req, res) => {
    res.type("css").send(MAILBOX_CSS);
  });

  router.get("/dev/mailbox", developmentOnly, async (req, res) => {
    const query = parseQuery(mailQuery, req.query);
    res.set("Cache-Control", "no-store").type("html").send(mailboxPage(await capturedMail(services.db, query)));
  });

  return router;
}
