import "server-only";
import { getEnv } from "@/server/env";
import { sendMail } from "./send-mail";

// Account mail: invitations and password resets. Links are absolute on APP_URL; the token is
// in the path only, never logged.

function escapeHtml(value: string): string {
  return value.replace(
    /[&<>"']/g,
    (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c] ?? c,
  );
}

function link(path: string): string {
  return new URL(path, getEnv().APP_URL).toString();
}

export async function sendInvitationEmail(input: {
  to: string;
  organizationName: string;
  inviterName: string;
  roles: string[];
  token: string;
  expiresAt: Date;
}): Promise<void> {
  const url = link(`/invite/${input.token}`);
  const until = input.expiresAt.toISOString().slice(0, 10);
  const text = [
    `${input.inviterName} invites you to join ${input.organizationName} on Sealpitch as ${input.roles.join(" and ")}.`,
    "",
    `Accept the invitation and choose your password: ${url}`,
    "",
    `The link works once and until ${until}. If you did not expect this, ignore this message.`,
  ].join("\n");
  const html = `<p>${escapeHtml(input.inviterName)} invites you to join <b>${escapeHtml(input.organizationName)}</b> on Sealpitch as ${escapeHtml(input.roles.join(" and "))}.</p><p><a href="${escapeHtml(url)}">Accept the invitation</a></p><p>The link works once and until ${until}.</p>`;
  await sendMail({ to: input.to, subject: `Join ${input.organizationName} on Sealpitch`, text, html });
}

export async function sendPasswordResetEmail(input: {
  to: string;
  token: string;
  validMinutes: number;
}): Promise<void> {
  const url = link(`/reset-password/${input.token}`);
  const text = [
    "Someone (hopefully you) asked to reset your Sealpitch password.",
    "",
    `Choose a new password: ${url}`,
    "",
    `The link works once and for ${input.validMinutes} minutes. If you did not ask, ignore this message; your password stays as it is.`,
  ].join("\n");
  const html = `<p>Someone (hopefully you) asked to reset your Sealpitch password.</p><p><a href="${escapeHtml(url)}">Choose a new password</a></p><p>The link works once and for ${input.validMinutes} minutes.</p>`;
  await sendMail({ to: input.to, subject: "Reset your Sealpitch password", text, html });
}
