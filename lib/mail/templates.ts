/**
 * The wording of every mail Changewise sends, as plain text and HTML. Pure functions: the data
 * in, the message out; every value is escaped in the HTML part. A mail never carries another
 * athlete's numbers: the caller passes only the recipient's own.
 */
import type { MailKind } from "@/lib/domain";

export type MailContent = { subject: string; text: string; html: string };

export type MailData = {
  invitation: { organizationName: string; inviterName: string; roleLabel: string; link: string; expiresOn: string };
  "password-reset": { link: string; validMinutes: number };
  "results-published": {
    athleteName: string;
    organizationName: string;
    sessionLabel: string;
    /** The recipient's own results only, already worded in each test's unit and decimals. */
    lines: { test: string; value: string; note?: string }[];
    link: string;
    /** Published again after changes: the mail says the results were updated. */
    updated?: boolean;
  };
  "deletion-request": { athleteName: string; organizationName: string; message: string | null; link: string };
};

export type MailOf<K extends MailKind> = { kind: K; data: MailData[K] };
export type AnyMail = { [K in MailKind]: MailOf<K> }[MailKind];

const ESCAPES: Record<string, string> = { "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" };
/** Escapes text for HTML element content and attribute values. */
export const escapeHtml = (text: string) => text.replace(/[&<>"']/g, (c) => ESCAPES[c]);

const FOOT_TEXT = "You get this mail because of your account with Changewise. Do not reply; nobody reads this address.";

function page(paragraphs: string[], action?: { label: string; link: string }): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 12px">${p}</p>`).join("");
  const button = action
    ? `<p style="margin:16px 0"><a href="${escapeHtml(action.link)}" style="background:#1E2A44;color:#ffffff;padding:10px 16px;border-radius:6px;text-decoration:none;font-weight:600">${escapeHtml(action.label)}</a></p><p style="margin:0 0 12px;color:#586176;font-size:13px">Or open this address: ${escapeHtml(action.link)}</p>`
    : "";
  return `<!doctype html><html lang="en"><body style="font-family:Barlow,Arial,sans-serif;color:#1E2A44;line-height:1.45;max-width:560px;margin:0 auto;padding:16px">${body}${button}<p style="margin:24px 0 0;color:#586176;font-size:12px">${escapeHtml(FOOT_TEXT)}</p></body></html>`;
}

const textOf = (paragraphs: string[], link?: string) =>
  [...paragraphs, ...(link ? [link] : []), "—", FOOT_TEXT].join("\n\n");

/** The message for one mail kind. */
export function renderMail(mail: AnyMail): MailContent {
  switch (mail.kind) {
    case "invitation": {
      const d = mail.data;
      const lines = [
        `${d.inviterName} invites you to join ${d.organizationName} on Changewise as ${d.roleLabel}.`,
        `Open the link to choose your password. It works once, until ${d.expiresOn}.`,
        "If you did not expect this invitation, ignore this mail; nothing happens without the link.",
      ];
      return {
        subject: `Join ${d.organizationName} on Changewise`,
        text: textOf(lines, d.link),
        html: page(lines.map(escapeHtml), { label: "Accept the invitation", link: d.link }),
      };
    }
    case "password-reset": {
      const d = mail.data;
      const lines = [
        "Someone asked to reset the password of your Changewise account.",
        `Open the link within ${d.validMinutes} minutes to choose a new one. It works once, and every other sign-in of your account ends when you use it.`,
        "If you did not ask, ignore this mail: your password stays as it is.",
      ];
      return {
        subject: "Reset your Changewise password",
        text: textOf(lines, d.link),
        html: page(lines.map(escapeHtml), { label: "Choose a new password", link: d.link }),
      };
    }
    case "results-published": {
      const d = mail.data;
      const intro = d.updated
        ? `Hello ${d.athleteName}, your results from ${d.sessionLabel} at ${d.organizationName} were updated. These are the numbers as they stand now.`
        : `Hello ${d.athleteName}, your results from ${d.sessionLabel} at ${d.organizationName} are in.`;
      const list = d.lines.map((l) => `${l.test}: ${l.value}${l.note ? ` (${l.note})` : ""}`);
      const outro = "Open My progress to see how they compare with your earlier tests.";
      return {
        subject: d.updated
          ? `Your results were updated — ${d.sessionLabel}`
          : `Your new results are in — ${d.sessionLabel}`,
        text: textOf([intro, list.map((l) => `• ${l}`).join("\n"), outro], d.link),
        html: page(
          [
            escapeHtml(intro),
            `<ul style="margin:0;padding-left:20px">${list.map((l) => `<li>${escapeHtml(l)}</li>`).join("")}</ul>`,
            escapeHtml(outro),
          ],
          { label: "Open My progress", link: d.link },
        ),
      };
    }
    case "deletion-request": {
      const d = mail.data;
      const lines = [
        `${d.athleteName} asks ${d.organizationName} to delete their athlete record and every result that belongs to it.`,
        ...(d.message ? [`Their message: “${d.message}”`] : []),
        "Open the People page to review the request. Deleting cannot be undone; check your own data-protection duties first.",
      ];
      return {
        subject: `Deletion request from ${d.athleteName}`,
        text: textOf(lines, d.link),
        html: page(lines.map(escapeHtml), { label: "Open the People page", link: d.link }),
      };
    }
  }
}
