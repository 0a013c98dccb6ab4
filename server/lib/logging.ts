// Logs: one pino JSON line per API request with a request id; secrets never reach a line.
import { randomUUID } from "node:crypto";
import type { IncomingMessage, ServerResponse } from "node:http";
import pino, { type DestinationStream, type Logger } from "pino";
import { pinoHttp } from "pino-http";

// Wherever these appear in a logged object they are replaced, whatever logged it.
const redactedPaths = [
  "req.headers.cookie",
  "req.headers.authorization",
  'res.headers["set-cookie"]',
  "headers.cookie",
  "headers.authorization",
  "*.password",
  "*.newPassword",
  "*.passwordHash",
  "*.token",
  "*.tokenHash",
  "*.sessionId",
  "password",
  "token",
];

// Tokens travel in some paths (share links, invitations); logs keep the route, not the secret.
function redactTokens(url: string): string {
  return url.replace(/\/(s|share|invitations)\/[A-Za-z0-9_-]{20,}/g, "/$1/[token]").replace(/token=[^&]+/g, "token=[token]");
}

// drizzle puts a failed query's parameters (e-mail addresses, hashes) into the message; logs keep the SQL only.
function withoutParameters(text: string): string {
  return text.replace(/\nparams:[\s\S]*?(?=\n\s+at |$)/, "\nparams: [redacted]");
}

interface LoggedError {
  type: string;
  message: string;
  code?: unknown;
  stack?: string;
  cause?: LoggedError;
}

// Only these members of an error reach a log line: a failed query's `params` (and anything else an
// error may carry) stay out. pino-http hands over an already serialized object, pino the Error itself.
function serializeError(error: unknown, depth = 0): LoggedError {
  if (error === null || typeof error !== "object") return { type: typeof error, message: withoutParameters(String(error)) };
  const { name, type, message, code, stack, cause } = error as { name?: unknown; type?: unknown; message?: unknown; code?: unknown; stack?: unknown; cause?: unknown };
  return {
    type: String(error instanceof Error ? error.name : (type ?? name ?? "Error")),
    message: withoutParameters(String(message ?? "")),
    ...(code === undefined ? {} : { code }),
    ...(typeof stack === "string" ? { stack: withoutParameters(stack) } : {}),
    ...(cause !== undefined && cause !== null && depth < 3 ? { cause: serializeError(cause, depth + 1) } : {}),
  };
}

export function createLogger(level: string, destination?: DestinationStream): Logger {
  return pino({ level, redact: { paths: redactedPaths, censor: "[redacted]" }, serializers: { err: serializeError } }, destination);
}

const requestIdPattern = /^[A-Za-z0-9._:-]{1,100}$/;

// A request id from the load balancer is kept, so one id follows a request across machines.
function requestId(req: IncomingMessage, res: ServerResponse): string {
  const given = req.headers["x-request-id"];
  const id = typeof given === "string" && requestIdPattern.test(given) ? given : randomUUID();
  res.setHeader("X-Request-Id", id);
  return id;
}

export function requestLogger(logger: Logger) {
  return pinoHttp({
    logger,
    genReqId: requestId,
    // Requests to the API and share pages are worth a line each; static assets are not.
    autoLogging: { ignore: (req) => !/^\/(api|s|dev)\//.test(req.url ?? "") },
    redact: { paths: redactedPaths, censor: "[redacted]" },
    serializers: {
      req: (req: { id: unknown; method: string; url: string }) => ({ id: req.id, method: req.method, url: redactTokens(req.url) }),
      res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
      err: serializeError,
    },
  });
}
