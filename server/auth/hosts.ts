// Which Host names the server answers to: PUBLIC_URL's and the loopback names. A page on another
// name (DNS rebinding: an attacker's name pointed at 127.0.0.1) is refused before any route runs.
import type { Request, RequestHandler } from "express";
import { HttpError } from "../lib/errors.js";

const loopbackNames = new Set(["localhost", "127.0.0.1", "[::1]", "::1"]);

/** The host name of a Host header ("name:port", "[::1]:port"), lower-case; null when unreadable. */
function hostName(header: string | undefined): string | null {
  if (!header) return null;
  try {
    return new URL(`http://${header}`).hostname.toLowerCase();
  } catch {
    return null;
  }
}

function isLoopbackName(name: string | null): boolean {
  return name !== null && (loopbackNames.has(name) || /^127(\.\d{1,3}){3}$/.test(name));
}

function isLoopbackAddress(address: string | undefined): boolean {
  return address === "::1" || /^(::ffff:)?127\./.test(address ?? "");
}

/** A request that came over loopback and names a loopback host: the only one the development mailbox answers. */
export function onLoopback(req: Request): boolean {
  return isLoopbackName(hostName(req.headers.host)) && isLoopbackAddress(req.socket.remoteAddress);
}

export function checkHost(publicUrl: string): RequestHandler {
  const configured = new URL(publicUrl).hostname.toLowerCase();
  return (req, _res, next) => {
    const name = hostName(req.headers.host);
    if (name === configured || isLoopbackName(name)) return next();
    next(new HttpError(421, "host_not_allowed", "This server answers only to its own address (PUBLIC_URL) and to loopback names."));
  };
}
