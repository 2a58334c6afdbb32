import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { getEnv } from "@/server/env";

// One SMTP client per process, built from the validated SMTP_* settings. Locally and in tests
// that is the fake SMTP server on 127.0.0.1 (scripts/fake-smtp.ts); production only changes
// the settings.
let transport: Transporter | undefined;

export function getMailTransport(): Transporter {
  if (!transport) {
    const env = getEnv();
    transport = nodemailer.createTransport({
      host: env.SMTP_HOST,
      port: env.SMTP_PORT,
      secure: env.SMTP_SECURE,
      auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASSWORD ?? "" } : undefined,
    });
  }
  return transport;
}
