// A large answer (a revision with its ledger runs to megabytes) is written as a stream of JSON
// chunks: the event loop serves other requests between chunks instead of stringifying it all at once.
import { pipeline } from "node:stream/promises";
import type { Response } from "express";
import { JsonStreamStringify } from "json-stream-stringify";

// Below this many characters of ledger, one JSON.stringify is quicker than a stream and blocks for well under a millisecond.
export const streamAbove = 16 * 1024;

type Step = { tex: string; explanation: string };

/** Sends a revision's answer (`value`), streamed when its ledger (`steps`) is large. */
export async function sendRevisionJson(res: Response, value: unknown, steps: Step[]): Promise<void> {
  const size = steps.reduce((sum, step) => sum + step.tex.length + step.explanation.length, 0);
  if (size < streamAbove) {
    res.json(value);
    return;
  }
  res.type("application/json");
  await pipeline(new JsonStreamStringify(value), res);
}
