// The local fake SMTP server's read-back API (scripts/fake-smtp.ts), for specs that follow a
// link the app mailed (invitations, password resets).
const OUTBOX = process.env.OUTBOX_URL ?? "http://127.0.0.1:2590";

/** The path of the newest `<path>/<token>` link mailed to `address` (polls for up to 10 s). */
export async function latestLink(address: string, path: string): Promise<string> {
  for (let attempt = 0; attempt < 40; attempt += 1) {
    const response = await fetch(`${OUTBOX}/api/messages?to=${encodeURIComponent(address)}`);
    const messages = (await response.json()) as { text: string }[];
    const match = messages.length
      ? new RegExp(`https?://[^\\s"<>]+${path}/[A-Za-z0-9_-]+`).exec(messages.at(-1)!.text)
      : null;
    if (match) return new URL(match[0]).pathname;
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  throw new Error(`no ${path} mail for ${address}`);
}

export function uniqueEmail(prefix: string): string {
  return `${prefix}-${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}@halden-creek.example`;
}
