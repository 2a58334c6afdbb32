import "server-only";
import { getEnv } from "@/server/env";
import { sendMail } from "./send-mail";

// Intent-named review mail: submitted (to the organisation's approvers, not the submitter),
// approved and returned (to the designer). Plain text first; the HTML carries the same words.
export interface RevisionMailInfo {
  designId: string;
  designName: string;
  number: number;
  actorName: string;
  comment?: string;
}

export interface ReviewMessage {
  subject: string;
  text: string;
  html: string;
}

export function revisionLink(designId: string, number: number, appUrl: string = getEnv().APP_URL): string {
  return `${appUrl.replace(/\/$/, "")}/designs/${designId}/revisions/${number}`;
}

const escapeHtml = (s: string): string =>
  s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

function compose(subject: string, lines: string[], link: string): ReviewMessage {
  const text = [...lines, "", `Open the review: ${link}`, "", "— Sealpitch"].join("\n");
  const html = `${lines.map((l) => `<p>${escapeHtml(l)}</p>`).join("")}<p><a href="${escapeHtml(link)}">Open the review</a></p><p>— Sealpitch</p>`;
  return { subject, text, html };
}

/** Pure builders (tests read them); `appUrl` is the public origin. */
export function buildRevisionSubmittedMessage(info: RevisionMailInfo, appUrl: string): ReviewMessage {
  return compose(
    `Review requested: ${info.designName} revision ${info.number}`,
    [
      `${info.actorName} submitted revision ${info.number} of ${info.designName} for review.`,
      "It is waiting for an approver who did not design it.",
    ],
    revisionLink(info.designId, info.number, appUrl),
  );
}

export function buildRevisionReturnedMessage(info: RevisionMailInfo, appUrl: string): ReviewMessage {
  return compose(
    `Returned: ${info.designName} revision ${info.number}`,
    [
      `${info.actorName} returned revision ${info.number} of ${info.designName}.`,
      `Comment: ${info.comment ?? ""}`,
      "Fix it and submit it again.",
    ],
    revisionLink(info.designId, info.number, appUrl),
  );
}

export function buildRevisionApprovedMessage(info: RevisionMailInfo, appUrl: string): ReviewMessage {
  const lines = [
    `${info.actorName} approved revision ${info.number} of ${info.designName}. It is now frozen.`,
  ];
  if (info.comment) lines.push(`Comment: ${info.comment}`);
  return compose(
    `Approved: ${info.designName} revision ${info.number}`,
    lines,
    revisionLink(info.designId, info.number, appUrl),
  );
}

async function sendEach(to: string[], message: ReviewMessage): Promise<void> {
  // One message per recipient, so nobody sees the others' addresses.
  for (const address of to) await sendMail({ to: address, ...message });
}

export async function sendRevisionSubmittedMail(to: string[], info: RevisionMailInfo): Promise<void> {
  await sendEach(to, buildRevisionSubmittedMessage(info, getEnv().APP_URL));
}

export async function sendRevisionReturnedMail(to: string[], info: RevisionMailInfo): Promise<void> {
  await sendEach(to, buildRevisionReturnedMessage(info, getEnv().APP_URL));
}

export async function sendRevisionApprovedMail(to: string[], info: RevisionMailInfo): Promise<void> {
  await sendEach(to, buildRevisionApprovedMessage(info, getEnv().APP_URL));
}
