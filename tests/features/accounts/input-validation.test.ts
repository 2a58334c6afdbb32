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

  it("follows only our own paths after sign-in", () => {
    expect(safeNextPath("/designs/1?tab=x")).toBe("/designs/1?tab=x");
    for (const bad of ["https://evil.example", "//evil.example", "/\\evil.example", "", undefined])
      expect(safeNextPath(bad)).toBe("/desk");
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
