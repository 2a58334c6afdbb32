// A local stand-in for the outgoing mail service. It accepts SMTP on 127.0.0.1 and keeps every
// message so people (a small inbox page) and tests (a JSON endpoint) can read it back.
//   tsx scripts/fake-smtp.ts --smtp 2525 --http 2580 [--store .data/outbox.json]
// The real mail service in production is only a change of SMTP_* settings.
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import http from "node:http";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

interface StoredMessage {
  id: number;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
  receivedAt: string;
}

function argument(name: string, fallback?: string): string {
  const index = process.argv.indexOf(`--${name}`);
  const value = index >= 0 ? process.argv[index + 1] : fallback;
  if (!value) {
    console.error(`fake-smtp: --${name} is required`);
    process.exit(2);
  }
  return value;
}

const smtpPort = Number(argument("smtp"));
const httpPort = Number(argument("http"));
const storePath = process.argv.includes("--store") ? argument("store") : null;

let messages: StoredMessage[] =
  storePath && existsSync(storePath) ? (JSON.parse(readFileSync(storePath, "utf8")) as StoredMessage[]) : [];
let nextId = messages.reduce((max, m) => Math.max(max, m.id), 0) + 1;

function persist(): void {
  if (storePath) writeFileSync(storePath, JSON.stringify(messages.slice(-500), null, 1));
}

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS"],
  banner: "Sealpitch local outbox",
  size: 10 * 1024 * 1024,
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((parsed) => {
        const recipients = session.envelope.rcptTo.map((r) => r.address.toLowerCase());
        messages.push({
          id: nextId++,
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : "",
          to: recipients,
          subject: parsed.subject ?? "",
          text: parsed.text ?? "",
          html: typeof parsed.html === "string" ? parsed.html : "",
          receivedAt: new Date().toISOString(),
        });
        persist();
        callback();
      })
      .catch((error: unknown) => callback(error instanceof Error ? error : new Error(String(error))));
  },
});

function escapeHtml(value: string): string {
  return value.replace(/[&<>"]/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;" })[c] ?? c);
}

function inboxPage(): string {
  const rows = [...messages]
    .reverse()
    .map(
      (m) =>
        `<article><header><b>${escapeHtml(m.subject)}</b><br><small>to ${escapeHtml(m.to.join(", "))} · ${m.receivedAt}</small></header><pre>${escapeHtml(m.text)}</pre></article>`,
    )
    .join("");
  return `<!doctype html><meta charset="utf-8"><title>Sealpitch local outbox</title><style>body{font:14px system-ui;margin:2rem;max-width:60rem}article{border:1px solid #ccd;border-radius:6px;padding:1rem;margin:0 0 1rem}pre{white-space:pre-wrap}</style><h1>Local outbox</h1><p>${messages.length} message(s) sent by Sealpitch on this machine. Nothing here leaves the machine.</p>${rows}`;
}

const api = http.createServer((request, response) => {
  const url = new URL(request.url ?? "/", `http://127.0.0.1:${httpPort}`);
  if (url.pathname === "/api/messages" && request.method === "GET") {
    const to = url.searchParams.get("to")?.toLowerCase();
    const list = to ? messages.filter((m) => m.to.includes(to)) : messages;
    response.writeHead(200, { "content-type": "application/json" }).end(JSON.stringify(list));
  } else if (url.pathname === "/api/messages" && request.method === "DELETE") {
    messages = [];
    persist();
    response.writeHead(204).end();
  } else if (url.pathname === "/" && request.method === "GET") {
    response.writeHead(200, { "content-type": "text/html; charset=utf-8" }).end(inboxPage());
  } else {
    response.writeHead(404, { "content-type": "application/json" }).end('{"error":"not found"}');
  }
});

function fail(what: string, error: NodeJS.ErrnoException): never {
  const reason = error.code === "EADDRINUSE" ? "the port is already in use" : error.message;
  console.error(`fake-smtp: cannot listen for ${what}: ${reason}`);
  process.exit(1);
}

smtp.on("error", (error) => console.error(`fake-smtp: ${error.message}`));
smtp.server.once("error", (error: NodeJS.ErrnoException) => fail(`SMTP on ${smtpPort}`, error));
api.once("error", (error: NodeJS.ErrnoException) => fail(`HTTP on ${httpPort}`, error));
smtp.listen(smtpPort, "127.0.0.1", () => {
  api.listen(httpPort, "127.0.0.1", () =>
    console.log(`fake-smtp: SMTP on 127.0.0.1:${smtpPort}, outbox at http://127.0.0.1:${httpPort}/`),
  );
});

for (const signal of ["SIGINT", "SIGTERM"] as const) {
  process.on(signal, () => {
    persist();
    smtp.close(() => api.close(() => process.exit(0)));
    setTimeout(() => process.exit(0), 1000).unref();
  });
}
