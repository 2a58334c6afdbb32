import "server-only";
import { getEnv } from "@/server/env";
import { getMailTransport } from "./transport";

export interface MailMessage {
  to: string | string[];
  subject: string;
  text: string;
  html?: string;
}

/** The generic sender under every intent-named message (server/mail/messages.ts, review-messages.ts). */
export async function sendMail(message: MailMessage): Promise<void> {
  await getMailTransport().sendMail({
    from: getEnv().MAIL_FROM,
    to: message.to,
    subject: message.subject,
    text: message.text,
    html: message.html,
  });
}
