import nodemailer, { type Transporter } from "nodemailer";
import type { Knex } from "knex";
import { db } from "~/lib/db.server";

// Every message goes through nodemailer and is kept in the outbox table, so an admin can follow
// invitations and resets locally (/admin/outbox). With SMTP_URL set it is also delivered by SMTP;
// otherwise nodemailer's JSON transport builds it and nothing leaves the machine ("capture").
export interface OutgoingEmail {
  teamId?: number | null;
  to: string;
  subject: string;
  text: string;
  html?: string;
}

let transporter: Transporter | undefined;
let transporterFor: string | undefined;

function getTransport(): { transport: Transporter; kind: "smtp" | "capture" } {
  const smtp = process.env.SMTP_URL?.trim() || "";
  if (!transporter || transporterFor !== smtp) {
    transporter = smtp ? nodemailer.createTransport(smtp) : nodemailer.createTransport({ jsonTransport: true });
    transporterFor = smtp;
  }
  return { transport: transporter, kind: smtp ? "smtp" : "capture" };
}

export const MAIL_FROM = () => process.env.MAIL_FROM ?? "Sparwise <no-reply@sparwise.local>";

/** Builds (and with SMTP_URL, delivers) the message and records it in the outbox; returns the outbox id. */
export async function sendEmail(message: OutgoingEmail, trx?: Knex.Transaction): Promise<number> {
  const { transport, kind } = getTransport();
  let status: string = kind;
  try {
    await transport.sendMail({ from: MAIL_FROM(), to: message.to, subject: message.subject, text: message.text, html: message.html });
  } catch (error) {
    // A mail server outage must not lose the invitation or reset: the outbox keeps it for the admin.
    console.error("sendEmail: delivery failed", error);
    status = "smtp-failed";
  }
  const [id] = await (trx ?? db)("outbox").insert({
    team_id: message.teamId ?? null,
    to_address: message.to,
    subject: message.subject.slice(0, 200),
    text_body: message.text,
    html_body: message.html ?? null,
    transport: status,
  });
  return Number(id);
}

// Links in e-mail come only from APP_URL, never from the request: Host and X-Forwarded-Host are
// whatever the sender typed, and a reset link pointing at their server hands them the token.
export const DEV_APP_URL = "http://localhost:3000";

/** The base of every link in e-mail: APP_URL; in development and tests DEV_APP_URL when unset. */
export function appBaseUrl(): string {
  const raw = process.env.APP_URL?.trim();
  if (!raw) {
    if (process.env.NODE_ENV === "production") {
      throw new Error(
        "APP_URL is not set: links in e-mail need the address people open Sparwise at (e.g. APP_URL=https://sparwise.example.com in .env). `npm run up` writes APP_URL=http://localhost:3000.",
      );
    }
    return DEV_APP_URL;
  }
  let url: URL;
  try {
    url = new URL(raw);
  } catch {
    throw new Error(`APP_URL is not a valid URL: ${JSON.stringify(raw)}. Give the full address, e.g. https://sparwise.example.com`);
  }
  if (url.protocol !== "http:" && url.protocol !== "https:") throw new Error(`APP_URL must start with http:// or https://, not ${url.protocol}`);
  // A path prefix is kept (the app may be served under one); a query or fragment would break every link.
  return url.origin + url.pathname.replace(/\/+$/, "");
}

/** Absolute link for e-mails, from APP_URL only. `path` starts with "/". */
export function appUrl(path: string): string {
  return appBaseUrl() + path;
}

// Fail at start, not at the first e-mail: the server bundle imports this module when it loads.
if (process.env.NODE_ENV === "production") appBaseUrl();
