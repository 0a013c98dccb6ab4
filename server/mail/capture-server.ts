// The local stand-in for a mail provider: a real SMTP server on loopback that stores every
// message it receives in PostgreSQL, where the development mailbox reads them.
import { simpleParser } from "mailparser";
import type { AddressInfo } from "node:net";
import { SMTPServer } from "smtp-server";
import type { Database } from "../db/client.js";
import { mailMessages } from "../db/schema.js";

export interface CaptureServer {
  host: string;
  port: number;
  close(): Promise<void>;
}

export async function startCaptureServer(db: Database, options: { port: number; host?: string }): Promise<CaptureServer> {
  const host = options.host ?? "127.0.0.1";
  const smtp = new SMTPServer({
    // Loopback only and nothing to protect: no authentication, no TLS upgrade offered.
    authOptional: true,
    disabledCommands: ["AUTH", "STARTTLS"],
    size: 20 * 1024 * 1024,
    logger: false,
    banner: "Portfold mail capture",
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          const from = session.envelope.mailFrom ? session.envelope.mailFrom.address : "";
          await db.insert(mailMessages).values({
            envelopeFrom: from,
            envelopeTo: session.envelope.rcptTo.map((recipient) => recipient.address.toLowerCase()),
            subject: parsed.subject ?? "",
            text: parsed.text ?? "",
            html: typeof parsed.html === "string" ? parsed.html : null,
          });
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  const address = await new Promise<AddressInfo>((resolve, reject) => {
    smtp.once("error", reject);
    const server = smtp.listen(options.port, host, () => {
      smtp.off("error", reject);
      resolve(server.address() as AddressInfo);
    });
  });
  return {
    host,
    port: address.port,
    close: () => new Promise<void>((resolve) => smtp.close(() => resolve())),
  };
}

// Prefers the configured port; when another program holds it, any free port will do,
// because the only sender is this same process.
export async function startCaptureServerNear(db: Database, preferredPort: number): Promise<CaptureServer> {
  try {
    return await startCaptureServer(db, { port: preferredPort });
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code !== "EADDRINUSE") throw error;
    return startCaptureServer(db, { port: 0 });
  }
}
