import { expect, test } from "./helpers/test";
import { latestLink, uniqueEmail } from "./helpers/outbox";
import { signIn, signOut } from "./helpers/sign-in";

const DEMO = [
  { email: "dana.designer@kestrel-ridge.example", name: "Dana", roles: "Designer", admin: false },
  { email: "arlo.approver@kestrel-ridge.example", name: "Arlo", roles: "Approver", admin: false },
  { email: "ines.admin@kestrel-ridge.example", name: "Ines", roles: "Designer, Administrator", admin: true },
  { email: "piet.lead@kestrel-ridge.example", name: "Piet", roles: "Designer, Approver", admin: false },
];

test.describe("demo sign-ins", () => {
  for (const user of DEMO) {
    test(`${user.email} lands on the desk with their roles`, async ({ page }) => {
      await signIn(page, user.email);
      await expect(page.getByRole("heading", { level: 1 })).toContainText(`Good to see you, ${user.name}`);
      await expect(page.getByTestId("desk-roles")).toHaveText(user.roles);
      await expect(page.getByText("Kestrel Ridge Process Works").first()).toBeVisible();
      const nav = page.getByRole("navigation", { name: "Workspace" });
      await expect(nav.getByRole("link", { name: "Joint register" })).toBeVisible();
      await expect(nav.getByRole("link", { name: "Crew" })).toHaveCount(user.admin ? 1 : 0);
      await signOut(page);
      await page.goto("/desk");
      await expect(page).toHaveURL(/\/sign-in\?next=%2Fdesk/);
    });
  }
});

test("a signed-out visit keeps ?next= and returns there after sign-in", async ({ page }) => {
  await page.goto("/desk");
  await expect(page).toHaveURL(/\/sign-in\?next=%2Fdesk/);
  await page.getByLabel("E-mail").fill("dana.designer@kestrel-ridge.example");
  await page.getByLabel("Password").fill("halden-creek-2026");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page).toHaveURL(/\/desk$/);
  await page.goto("/");
  await expect(page.getByRole("link", { name: "Open your desk" })).toBeVisible();
});

test("a designer gets the 403 page on the admin screen", async ({ page }) => {
  await signIn(page, "dana.designer@kestrel-ridge.example");
  const response = await page.goto("/team");
  expect(response?.status()).toBe(403);
  await expect(page.getByRole("heading", { level: 1 })).toContainText("Your role does not open this page");
});

async function signUp(
  page: import("@playwright/test").Page,
  email: string,
  password: string,
  name: string,
  organization: string,
) {
  await page.goto("/sign-up");
  await page.getByLabel("Your name").fill(name);
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Organisation").fill(organization);
  await page.getByLabel("Password", { exact: true }).fill(password);
  await page.getByLabel("Repeat the password").fill(password);
  await page.getByRole("button", { name: "Start the organisation" }).click();
  await expect(page).toHaveURL(/\/desk$/);
}

test("an admin invites a member who accepts by e-mail, lands in the organisation and signs in again", async ({
  page,
}) => {
  const email = uniqueEmail("mara.invitee");
  await signIn(page, "ines.admin@kestrel-ridge.example");
  await page.getByRole("navigation", { name: "Workspace" }).getByRole("link", { name: "Crew" }).click();
  await expect(page.getByRole("heading", { level: 1 })).toContainText(
    "Who works in Kestrel Ridge Process Works",
  );
  const form = page.getByRole("form", { name: "Invite a member" });
  await form.getByLabel("E-mail").fill(email);
  await form.getByLabel("Approver").check();
  await form.getByRole("button", { name: "Send invitation" }).click();
  await expect(form.getByRole("status")).toHaveText(`Invitation sent to ${email}.`);
  await expect(page.getByRole("cell", { name: email, exact: true })).toBeVisible();
  await signOut(page);

  const link = await latestLink(email, "/invite");
  await page.goto(link);
  await expect(page.getByRole("heading", { level: 1 })).toHaveText("Join Kestrel Ridge Process Works");
  await page.getByLabel("Your name").fill("Mara Quist");
  await page.getByLabel("Password", { exact: true }).fill("gasket-seat-2026");
  await page.getByLabel("Repeat the password").fill("gasket-seat-2026");
  await page.getByRole("button", { name: "Join the organisation" }).click();
  await expect(page).toHaveURL(/\/desk$/);
  await expect(page.getByRole("heading", { level: 1 })).toContainText("Good to see you, Mara");
  await expect(page.getByTestId("desk-roles")).toHaveText("Designer, Approver");
  await signOut(page);

  // The link is spent.
  await page.goto(link);
  await expect(page.getByRole("alert").filter({ hasText: "already been used" })).toBeVisible();

  await signIn(page, email, "gasket-seat-2026");
  await expect(page.getByText("Kestrel Ridge Process Works").first()).toBeVisible();
});

test("forgot password → e-mail → reset → sign in with the new password (old one refused)", async ({
  page,
}) => {
  const email = uniqueEmail("oskar.reset");
  await signUp(page, email, "first-password-26", "Oskar Brandt", "Brandt Flange Services");
  await signOut(page);

  await page.goto("/sign-in");
  await page.getByRole("link", { name: "Forgot your password?" }).click();
  await expect(page).toHaveURL(/\/forgot-password$/);
  await page.getByLabel("E-mail").fill(email);
  await page.getByRole("button", { name: "Send the reset link" }).click();
  await expect(page.getByRole("status")).toHaveText(
    "If an account exists for that address, we have sent a link.",
  );

  const link = await latestLink(email, "/reset-password");
  await page.goto(link);
  await page.getByLabel("New password").fill("second-password-26");
  await page.getByLabel("Repeat the password").fill("second-password-26");
  await page.getByRole("button", { name: "Set the new password" }).click();
  await expect(page).toHaveURL(/\/sign-in\?reset=1/);
  await expect(page.getByText("Password changed.")).toBeVisible();

  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill("first-password-26");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByRole("status")).toHaveText("E-mail or password is wrong.");
  await signIn(page, email, "second-password-26");
  await expect(page.getByText("Brandt Flange Services").first()).toBeVisible();

  await page.goto(link);
  await expect(page.getByRole("alert").filter({ hasText: "already been used" })).toBeVisible();
});

test("bad sign-in input gets field messages; wrong passwords past the limit get the try-again message", async ({
  page,
  context,
}) => {
  // A dedicated account and client address, so the demo users and other specs are never locked out.
  await context.setExtraHTTPHeaders({
    "x-forwarded-for": `198.51.100.${Math.floor(Math.random() * 250) + 1}`,
  });
  const email = uniqueEmail("lena.lockout");
  await signUp(page, email, "correct-password-26", "Lena Voss", "Voss Pressure Parts");
  await signOut(page);

  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByText("Enter your e-mail address.")).toBeVisible();
  await expect(page.getByText("Enter your password.")).toBeVisible();
  await page.getByLabel("E-mail").fill("lena@voss");
  await page.getByLabel("Password").fill("x".repeat(1100));
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByText("Enter a valid e-mail address, like name@example.com.")).toBeVisible();
  await expect(page.getByText("Passwords are limited to 1024 characters.")).toBeVisible();

  for (let i = 0; i < 5; i += 1) {
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password").fill(`wrong-${i}`);
    await page.getByRole("button", { name: "Sign in" }).click();
    await expect(page.getByRole("status")).toHaveText("E-mail or password is wrong.");
    // A refused submit keeps the e-mail and clears the password.
    await expect(page.getByLabel("E-mail")).toHaveValue(email);
    await expect(page.getByLabel("Password")).toHaveValue("");
  }
  await page.getByLabel("Password").fill("correct-password-26");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByRole("status")).toHaveText(/^Too many attempts\. Try again in 1[45] minutes\.$/);
  await expect(page).toHaveURL(/\/sign-in/);
});

test("what the browser receives for the signed-in shell holds no password hash and no session secret", async ({
  page,
  context,
}) => {
  const bodies: { url: string; body: string }[] = [];
  page.on("response", async (response) => {
    const type = response.headers()["content-type"] ?? "";
    if (!/json|html|text|x-component/.test(type)) return;
    try {
      bodies.push({ url: response.url(), body: await response.text() });
    } catch {
      // redirects and aborted prefetches have no body
    }
  });
  await signIn(page, "ines.admin@kestrel-ridge.example");
  await page.goto("/team");
  await page.getByRole("navigation", { name: "Workspace" }).getByRole("link", { name: "Desk" }).click();
  await expect(page.getByRole("heading", { level: 1 })).toContainText("Good to see you, Ines");
  const me = await page.request.get("/api/v1/me");
  expect(me.status()).toBe(200);
  const meJson = (await me.json()) as Record<string, unknown>;
  expect(Object.keys(meJson).sort()).toEqual([
    "displayName",
    "email",
    "organizationId",
    "organizationName",
    "organizationSlug",
    "roles",
    "unitSystem",
    "userId",
  ]);
  bodies.push({ url: "/api/v1/me", body: JSON.stringify(meJson) });
  const rsc = await page.request.get("/desk", { headers: { rsc: "1" } });
  bodies.push({ url: "/desk (RSC)", body: await rsc.text() });

  const session = (await context.cookies()).find((c) => c.name === "sealpitch_session");
  expect(session?.httpOnly).toBe(true);
  expect(session?.sameSite).toBe("Lax");
  expect(bodies.length).toBeGreaterThan(3);
  for (const { url, body } of bodies) {
    expect(body, url).not.toContain("$argon2");
    expect(body, url).not.toContain("password_hash");
    expect(body, url).not.toContain(session!.value);
  }
});
