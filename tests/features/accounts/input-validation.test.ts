import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as inviteRoute } from "@/app/api/v1/team/route";
import {
  acceptInvitationSchema,
  forgotPasswordSchema,
  inviteMemberSchema,
  safeNextPath,
  signInSchema,
  signUpSchema,
} from "@/features/accounts/schema";
import { appRequest, createOrganizationWithMembers, type OrganizationFixture } from "../../setup/fixtures";
import { getTestDb } from "../../setup/test-db";

const db = getTestDb();
const KB = "a".repeat(1025);
const firstErrors = (result: {
  success: boolean;
  error?: { issues: { path: PropertyKey[]; message: string }[] };
}) => Object.fromEntries((result.error?.issues ?? []).reverse().map((i) => [String(i.path[0]), i.message]));

describe("account form inputs", () => {
  it("sign-in: empty, over 1 KB and malformed e-mails each get a field message", () => {
    expect(firstErrors(signInSchema.safeParse({ email: "", password: "" }))).toMatchObject({
      email: "Enter your e-mail address.",
      password: "Enter your password.",
    });
    expect(firstErrors(signInSchema.safeParse({ email: `${KB}@x.example`, password: KB }))).toMatchObject({
      email: "An e-mail address has at most 254 characters.",
      password: "Passwords are limited to 1024 characters.",
    });
    for (const email of ["dana", "dana@", "@kestrel.example", "dana@kestrel", "da na@kestrel.example"]) {
      expect(firstErrors(signInSchema.safeParse({ email, password: "x" })).email, email).toBe(
        "Enter a valid e-mail address, like name@example.com.",
      );
    }
    expect(signInSchema.parse({ email: "  Dana.Designer@Kestrel-Ridge.Example ", password: "x" }).email).toBe(
      "dana.designer@kestrel-ridge.example",
    );
  });

  it("sign-up: short password, mismatch and long organisation name", () => {
    const errors = firstErrors(
      signUpSchema.safeParse({
        displayName: "",
        email: "a@b.example",
        organizationName: KB,
        password: "short",
        confirmPassword: "other",
      }),
    );
    expect(errors).toMatchObject({
      displayName: "Enter your name.",
      organizationName: "Organisation names are limited to 120 characters.",
      password: "Use at least 10 characters.",
    });
    expect(
      firstErrors(
        signUpSchema.safeParse({
          displayName: "A",
          email: "a@b.example",
          organizationName: "Ab",
          password: "long-enough-1",
          confirmPassword: "long-enough-2",
        }),
      ),
    ).toEqual({
      confirmPassword: "The two passwords differ.",
    });
  });

  it("reset, invitation and invite inputs are bounded", () => {
    expect(firstErrors(forgotPasswordSchema.safeParse({ email: KB }))).toMatchObject({
      email: expect.any(String),
    });
    expect(acceptInvitationSchema.safeParse({ token: KB, password: "x" }).success).toBe(false);
    expect(firstErrors(inviteMemberSchema.safeParse({ email: "x@y.example", roles: [] }))).toEqual({
      roles: "Choose at least one role.",
    });
    expect(inviteMemberSchema.safeParse({ email: "x@y.example", roles: ["owner"] }).success).toBe(false);
  });

  it("follows only our own pages after sign-in, resolved against APP_URL", () => {
    const app = "http://127.0.0.1:3100";
    // Good paths keep their query and fragment; a relative path resolves under the app too.
    expect(safeNextPath("/designs/1?tab=x", app)).toBe("/designs/1?tab=x");
    expect(safeNextPath("/designs/1?next=%2F%2Fevil.example#checks", app)).toBe(
      "/designs/1?next=%2F%2Fevil.example#checks",
    );
    expect(safeNextPath("http://127.0.0.1:3100/library/gaskets", app)).toBe("/library/gaskets");
    // An encoded tab stays inside our path (the browser does not decode it into the Location).
    expect(safeNextPath("/%09/evil.example", app)).toBe("/%09/evil.example");
    for (const bad of [
      "/\t/evil.example", // the decoded form of next=/%09/evil.example
      "/\n/evil.example",
      "//evil.example",
      "//evil",
      "/\\evil.example",
      "\\\\evil.example",
      "https://evil.example",
      "https://127.0.0.1:3100.evil.example/",
      "http://127.0.0.1:3101/desk",
      "https://127.0.0.1:3100/desk",
      "javascript:alert(1)",
      " javascript:alert(1)",
      "JaVaScRiPt:alert(1)",
      "data:text/html,<script>alert(1)</script>",
      decodeURIComponent("%2F%2Fevil.example"),
      decodeURIComponent("%2F%5Cevil.example"),
      decodeURIComponent("%2F%09%2Fevil.example"),
      "",
      undefined,
    ])
      expect(safeNextPath(bad, app), JSON.stringify(bad)).toBe("/desk");
  });
});

describe("bad input changes nothing", () => {
  let org: OrganizationFixture<"boss">;
  beforeAll(async () => {
    org = await createOrganizationWithMembers(db, { boss: ["admin"] });
  });
  afterAll(() => org.cleanup());

  it("an invite with a malformed, empty or 1 KB address answers 400 with the field message and writes no row", async () => {
    const cookie = await org.cookieFor("boss");
    for (const [email, message] of [
      ["not-an-address", "Enter a valid e-mail address, like name@example.com."],
      ["", "Enter your e-mail address."],
      [`${KB}@x.example`, "An e-mail address has at most 254 characters."],
    ]) {
      const response = await inviteRoute(
        appRequest("/api/v1/team", { method: "POST", cookie, body: { email, roles: ["designer"] } }),
      );
      expect(response.status).toBe(400);
      const body = (await response.json()) as { error: { fieldErrors: Record<string, string[]> } };
      expect(body.error.fieldErrors.email[0]).toBe(message);
    }
    const rows = await db
      .selectFrom("invitations")
      .select("id")
      .where("organization_id", "=", org.organizationId)
      .execute();
    expect(rows).toEqual([]);
  });
});
