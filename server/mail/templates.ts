// The e-mails Portfold sends: plain text first, a simple HTML twin with every user text escaped.
import { escapeHtml } from "../lib/html.js";
import type { OutgoingMail } from "./mailer.js";

interface Letter {
  to: string;
  subject: string;
  paragraphs: string[];
  link: { label: string; url: string };
  footnote?: string;
}

function compose(letter: Letter): OutgoingMail {
  const text = [...letter.paragraphs, `${letter.link.label}: ${letter.link.url}`, ...(letter.footnote ? [letter.footnote] : []), "— Portfold"].join("\n\n");
  const html = [
    ...letter.paragraphs.map((paragraph) => `<p>${escapeHtml(paragraph)}</p>`),
    `<p><a href="${escapeHtml(letter.link.url)}">${escapeHtml(letter.link.label)}</a></p>`,
    ...(letter.footnote ? [`<p style="color:#666">${escapeHtml(letter.footnote)}</p>`] : []),
    "<p>— Portfold</p>",
  ].join("\n");
  return { to: letter.to, subject: letter.subject, text, html };
}

export function verificationMail(to: string, name: string, url: string): OutgoingMail {
  return compose({
    to,
    subject: "Confirm your e-mail address for Portfold",
    paragraphs: [`Hello ${name},`, "Confirm that this address is yours to finish setting up your Portfold account."],
    link: { label: "Confirm my address", url },
    footnote: "The link works once and expires in 48 hours. If you did not sign up, ignore this message.",
  });
}

export function passwordResetMail(to: string, name: string, url: string): OutgoingMail {
  return compose({
    to,
    subject: "Reset your Portfold password",
    paragraphs: [`Hello ${name},`, "Someone asked to reset the password of your Portfold account. Choose a new one here:"],
    link: { label: "Choose a new password", url },
    footnote: "The link works once and expires in one hour. If you did not ask for this, ignore this message; your password stays as it is.",
  });
}

export function invitationMail(to: string, inviter: string, teamName: string, role: string, url: string): OutgoingMail {
  return compose({
    to,
    subject: `${inviter} invited you to "${teamName}" on Portfold`,
    paragraphs: [`${inviter} invited you to join the team "${teamName}" on Portfold as ${role}.`],
    link: { label: "Accept the invitation", url },
    footnote: "The invitation expires in 7 days. Sign in or create an account with any address to accept it.",
  });
}

export function commentMail(to: string, commenter: string, networkTitle: string, revision: number, stepTitle: string, body: string, url: string): OutgoingMail {
  return compose({
    to,
    subject: `New comment on "${networkTitle}" revision ${revision}`,
    paragraphs: [`${commenter} commented on the step "${stepTitle}" of revision ${revision} of "${networkTitle}":`, body],
    link: { label: "Open the revision", url },
  });
}

export function verdictMail(to: string, reviewer: string, networkTitle: string, revision: number, verdict: string, url: string): OutgoingMail {
  return compose({
    to,
    subject: `Revision ${revision} of "${networkTitle}": ${verdict}`,
    paragraphs: [`${reviewer} set the verdict on revision ${revision} of "${networkTitle}" to: ${verdict}.`],
    link: { label: "Open the revision", url },
  });
}
