/** E-mail through nodemailer (in development and tests: the local fake SMTP server). */
import type { EntityManager } from "@mikro-orm/postgresql";
import nodemailer from "nodemailer";
import { Membership } from "../../entities";

export const DEFAULT_SMTP_URL = "smtp://127.0.0.1:2525";
const FROM = process.env.SHEARWIRE_MAIL_FROM ?? "Shearwire <no-reply@shearwire.local>";

const holder = globalThis as unknown as { __shearwireMail?: nodemailer.Transporter };

function transport(): nodemailer.Transporter {
  holder.__shearwireMail ??= nodemailer.createTransport(process.env.SMTP_URL ?? DEFAULT_SMTP_URL);
  return holder.__shearwireMail;
}

export async function sendMail(to: string[], subject: string, text: string) {
  if (!to.length) return;
  await transport().sendMail({ from: FROM, to, subject, text });
}

/** The e-mail addresses of a shop's owners and admins. */
export async function shopAdmins(em: EntityManager, shopId: string): Promise<string[]> {
  const members = await em.find(
    Membership,
    { shop: shopId, role: { $in: ["owner", "admin"] } },
    { populate: ["user"] },
  );
  return members.map((m) => m.user.email);
}

export async function mailEndpointDisabled(
  em: EntityManager,
  shopId: string,
  endpoint: { id: string; url: string },
  reason: string,
) {
  const base = process.env.SHEARWIRE_BASE_URL ?? "http://127.0.0.1:3000";
  await sendMail(
    await shopAdmins(em, shopId),
    `Webhook endpoint disabled: ${endpoint.url}`,
    [
      `Shearwire stopped sending events to ${endpoint.url} (${endpoint.id}) because ${reason}.`,
      "",
      "Events keep being recorded. When the receiver works again, enable the endpoint in the console",
      `(${base}/console/webhooks) or with PATCH /api/v1/webhook-endpoints/${endpoint.id} {"enabled": true},`,
      "then resend the events it missed.",
    ].join("\n"),
  );
}
