// The page behind a share link: the client's shell with link-preview meta tags filled in on the server.
import { Router } from "express";
import { readFile } from "node:fs/promises";
import { sharePreview } from "../domain/shares.js";
import type { Services } from "../domain/services.js";
import { escapeHtml } from "../lib/html.js";

const genericTitle = "Shared derivation · Portfold";
const genericDescription = "A derivation shared from Portfold. This link is not valid (any more).";

// Link previews show a line or two; a result of thousands of terms stays on the page itself.
const previewMax = { title: 120, description: 300 };
const clip = (text: string, max: number) => (text.length > max ? `${text.slice(0, max - 1)}…` : text);

function withPreview(shell: string, preview: { title: string; description: string; url?: string }): string {
  const title = escapeHtml(clip(preview.title, previewMax.title));
  const description = escapeHtml(clip(preview.description, previewMax.description));
  const tags = [
    `<meta property="og:type" content="article" />`,
    `<meta property="og:site_name" content="Portfold" />`,
    `<meta property="og:title" content="${title}" />`,
    `<meta property="og:description" content="${description}" />`,
    ...(preview.url ? [`<meta property="og:url" content="${escapeHtml(preview.url)}" />`] : []),
    `<meta name="twitter:card" content="summary" />`,
    // Share links are unlisted: keep them out of search indexes.
    `<meta name="robots" content="noindex, nofollow" />`,
  ].join("\n    ");
  // Replacer functions, so a "$&" in a title is text, not a replacement pattern.
  return shell
    .replace(/<title>[\s\S]*?<\/title>/, () => `<title>${title}</title>`)
    .replace(/<meta\s+name="description"[^>]*>/, () => `<meta name="description" content="${description}" />`)
    .replace("</head>", () => `    ${tags}\n  </head>`);
}

export function sharePageRouter(services: Services, shellPath: string): Router {
  const router = Router();
  router.get("/s/:token", async (req, res) => {
    const shell = await readFile(shellPath, "utf8");
    const token = req.params.token;
    const preview = /^[A-Za-z0-9_-]{43}$/.test(token) ? await sharePreview(services.db, token) : null;
    const page = preview
      ? withPreview(shell, { ...preview, url: `${services.settings.publicUrl}/s/${token}` })
      : withPreview(shell, { title: genericTitle, description: genericDescription });
    // Revocation must take effect at once, so nothing in between may keep a copy.
    res.status(preview ? 200 : 404).set("Cache-Control", "no-store").type("html").send(page);
  });
  return router;
}
