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
