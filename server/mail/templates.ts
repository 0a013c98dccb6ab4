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
    footnote: `The invitation expires in 7 days. It is for ${to} only: sign in or create an account with this address, and confirm it, to accept.`,
  });
}

const reviewFootnote = "You get review mail because you take part in this review; turn it off under Account settings in Portfold.";

export function commentMail(
  to: string,
  note: { commenter: string; networkTitle: string; revision: number; stepTitle: string; body: string; reply: boolean; url: string },
): OutgoingMail {
  return compose({
    to,
    subject: `${note.reply ? "New reply" : "New comment"} on "${note.networkTitle}" revision ${note.revision}`,
    paragraphs: [
      `${note.commenter} ${note.reply ? "replied in a thread" : "commented"} on the step "${note.stepTitle}" of revision ${note.revision} of "${note.networkTitle}":`,
      note.body,
    ],
    link: { label: "Open the revision", url: note.url },
    footnote: reviewFootnote,
  });
}

export function verdictMail(
  to: string,
  verdict: { reviewer: string; action: string; networkTitle: string; revision: number; state: string; note: string | null; url: string },
): OutgoingMail {
  return compose({
    to,
    subject: `Revision ${verdict.revision} of "${verdict.networkTitle}": ${verdict.state}`,
    paragraphs: [
      `${verdict.reviewer} ${verdict.action} revision ${verdict.revision} of "${verdict.networkTitle}". The revision now reads: ${verdict.state}.`,
      ...(verdict.note ? [verdict.note] : []),
    ],
    link: { label: "Open the revision", url: verdict.url },
    footnote: reviewFootnote,
  });
}
