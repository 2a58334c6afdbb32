import { randomUUID } from "node:crypto";
import { sampleCover } from "@/tests/fixtures/sample-cover";
import { readFileSync } from "node:fs";
import { expect, test } from "./helpers/test";
import { latestLink, uniqueEmail } from "./helpers/outbox";
import { signIn, signOut } from "./helpers/sign-in";

// The server's structured log, read from the test app's own output (scripts/lib/test-stack.sh
// exports its path). Sign-in, an invitation accepted, a password reset and a design save go
// through the real app; afterwards no password, token, session id, cookie or document content
// appears anywhere in the log, while every request line carries its id, route, status and
// duration, and the signed-in lines the user and organisation.
const APP_LOG = process.env.SEALPITCH_APP_LOG;
const APP_URL = process.env.APP_URL ?? "http://127.0.0.1:3100";

interface LogLine {
  level: string;
  msg: string;
  reqId?: string;
  route?: string;
  status?: number;
  durationMs?: number;
  userId?: string | null;
  organizationId?: string | null;
}

function readLog(): { text: string; lines: LogLine[] } {
  const text = readFileSync(APP_LOG!, "utf8");
  const lines = text
    .split("\n")
    .filter((line) => line.startsWith("{"))
    .map((line) => JSON.parse(line) as LogLine);
  return { text, lines };
}

test("the log holds one structured line per request and none of the secrets", async ({ page }) => {
  test.skip(!APP_LOG, "SEALPITCH_APP_LOG is set by npm test");
  const email = uniqueEmail("ravi.logscan");
  const firstPassword = `first-${randomUUID().slice(0, 12)}`;
  const secondPassword = `second-${randomUUID().slice(0, 12)}`;
  const marker = `docmarker${randomUUID().replace(/-/g, "")}`;

  // Invitation: an admin invites, the invitee accepts with a password.
  await signIn(page, "ines.admin@kestrel-ridge.example");
  await page.getByRole("navigation", { name: "Workspace" }).getByRole("link", { name: "Crew" }).click();
  const form = page.getByRole("form", { name: "Invite a member" });
  await form.getByLabel("E-mail").fill(email);
  await form.getByLabel("Designer").check();
  await form.getByRole("button", { name: "Send invitation" }).click();
  await expect(form.getByRole("status")).toHaveText(`Invitation sent to ${email}.`);
  const adminCookies = (await page.context().cookies()).map((c) => c.value);
  await signOut(page);
  const invitePath = await latestLink(email, "/invite");
  await page.goto(invitePath);
  await page.getByLabel("Your name").fill("Ravi Logscan");
  await page.getByLabel("Password", { exact: true }).fill(firstPassword);
  await page.getByLabel("Repeat the password").fill(firstPassword);
  await page.getByRole("button", { name: "Join the organisation" }).click();
  await expect(page).toHaveURL(/\/desk$/);
  await signOut(page);

  // Reset: forgot password, mail, new password, sign in with it.
  await page.goto("/forgot-password");
  await page.getByLabel("E-mail").fill(email);
  await page.getByRole("button", { name: "Send the reset link" }).click();
  await expect(page.getByRole("status")).toHaveText(
    "If an account exists for that address, we have sent a link.",
  );
  const resetPath = await latestLink(email, "/reset-password");
  await page.goto(resetPath);
  await page.getByLabel("New password").fill(secondPassword);
  await page.getByLabel("Repeat the password").fill(secondPassword);
  await page.getByRole("button", { name: "Set the new password" }).click();
  await expect(page).toHaveURL(/\/sign-in\?reset=1/);
  await signIn(page, email, secondPassword);

  // A design created and saved through the API, with a marker inside the document.
  const document = sampleCover("Logscan cover", "LS-1");
  const created = await page.request.post("/api/v1/designs", {
    data: { name: "Logscan cover", equipmentTag: "LS-1", document },
    headers: { origin: APP_URL },
  });
  expect(created.status(), await created.text()).toBe(201);
  const { designId, version } = (await created.json()) as { designId: string; version: number };
  const saved = await page.request.put(`/api/v1/designs/${designId}`, {
    data: {
      baseVersion: version,
      document: {
        ...document,
        gasket: { ...document.gasket, material: { ...document.gasket.material, name: marker } },
      },
    },
    headers: { origin: APP_URL, "x-request-id": `logscan-${marker.slice(-12)}` },
  });
  expect(saved.status(), await saved.text()).toBe(200);
  // The request id comes back in the response, the caller's own when it sent a sane one.
  expect(saved.headers()["x-request-id"]).toBe(`logscan-${marker.slice(-12)}`);
  const listed = await page.request.get("/api/v1/designs");
  const listedId = listed.headers()["x-request-id"];
  expect(listedId).toMatch(/^[0-9a-f-]{36}$/);
  const sessionCookies = (await page.context().cookies()).map((c) => c.value);

  // pino writes synchronously to stdout; give the pipe a moment to reach the file.
  await expect
    .poll(() => readLog().lines.some((line) => line.reqId === `logscan-${marker.slice(-12)}`))
    .toBe(true);
  const { text, lines } = readLog();
  const inviteToken = invitePath.split("/").at(-1)!;
  const resetToken = resetPath.split("/").at(-1)!;
  const secrets = {
    firstPassword,
    secondPassword,
    demoPassword: "halden-creek-2026",
    inviteToken,
    resetToken,
    marker,
    ...Object.fromEntries([...adminCookies, ...sessionCookies].map((value, i) => [`cookie${i}`, value])),
  };
  for (const [what, secret] of Object.entries(secrets)) {
    expect(secret.length, what).toBeGreaterThan(7);
    expect(text.includes(secret), `${what} appears in the log`).toBe(false);
  }

  const save = lines.find((line) => line.reqId === `logscan-${marker.slice(-12)}`)!;
  expect(save).toMatchObject({ msg: "request", route: "/api/v1/designs/[designId]", status: 200 });
  expect(save.durationMs).toBeGreaterThan(0);
  expect(save.userId).toMatch(/^[0-9a-f-]{36}$/);
  expect(save.organizationId).toMatch(/^[0-9a-f-]{36}$/);
  expect(lines.find((line) => line.reqId === listedId)).toMatchObject({
    route: "/api/v1/designs",
    status: 200,
  });
  // Server actions (sign-in, invitation, reset) each wrote a line with their outcome.
  const actions = lines.filter((line) => line.route?.startsWith("action "));
  expect(actions.map((line) => line.route)).toEqual(
    expect.arrayContaining([
      "action accounts.signIn",
      "action accounts.acceptInvitation",
      "action accounts.resetPassword",
    ]),
  );
  for (const line of lines.filter((l) => l.msg === "request")) {
    expect(line.reqId, JSON.stringify(line)).toBeTruthy();
    expect(typeof line.status).toBe("number");
    expect(typeof line.durationMs).toBe("number");
  }
});
