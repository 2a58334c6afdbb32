// Reads mail back from the fake SMTP server's JSON API (OUTBOX_URL, set by scripts/test.sh).
export interface OutboxMessage {
  id: number;
  to: string[];
  subject: string;
  text: string;
  html: string;
}

export async function messagesTo(address: string): Promise<OutboxMessage[]> {
  const base = process.env.OUTBOX_URL;
  if (!base) throw new Error("OUTBOX_URL is not set: run through `npm test`.");
  const response = await fetch(`${base}/api/messages?to=${encodeURIComponent(address)}`);
  return (await response.json()) as OutboxMessage[];
}

export function linkIn(message: OutboxMessage, path: string): string {
  const match = new RegExp(`https?://[^\\s"<>]+${path}/[A-Za-z0-9_-]+`).exec(message.text);
  if (!match) throw new Error(`no ${path} link in: ${message.text}`);
  return match[0];
}
