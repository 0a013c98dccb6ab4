import nodemailer from "nodemailer";
import type { Logger } from "pino";
import { config } from "../config.js";

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
  // Two sends with one key are one mail (the queue's idempotency key); without, the content is the key.
  key?: string;
}

// A mail that cannot be delivered is logged, never turned into a failed request.
export interface Mailer {
  send(mail: OutgoingMail): Promise<boolean>;
}

export interface SmtpTarget {
  host: string;
  port: number;
  secure?: boolean;
  user?: string;
  password?: string;
  // How long a connection, the greeting and each reply may take; a silent server fails the delivery.
  timeoutMs?: number;
}

// Where mail goes: the provider when SMTP_HOST is set, else the local capture server on loopback.
export function smtpTarget(capturePort = config.mail.capturePort): SmtpTarget {
  const mail = config.mail;
  if (!mail.smtpHost) return { host: "127.0.0.1", port: capturePort };
  return { host: mail.smtpHost, port: mail.smtpPort, secure: mail.smtpSecure, user: mail.smtpUser, password: mail.smtpPassword };
}

// Always real SMTP: to the capture server locally, to the provider in production.
export function createSmtpMailer(target: SmtpTarget, from: string, log?: Logger): Mailer {
  const transport = nodemailer.createTransport({
    host: target.host,
    port: target.port,
    secure: target.secure ?? false,
    auth: target.user ? { user: target.user, pass: target.password ?? "" } : undefined,
    connectionTimeout: target.timeoutMs ?? 10_000,
    greetingTimeout: target.timeoutMs ?? 10_000,
    socketTimeout: target.timeoutMs ?? 10_000,
  });
  return {
    async send(mail) {
      try {
        const { key: _key, ...letter } = mail;
        await transport.sendMail({ from, ...letter });
        return true;
      } catch (error) {
        log?.error({ err: error, subject: mail.subject }, "mail not delivered");
        return false;
      }
    },
  };
}
