import { expect, test } from "@playwright/test";
import { signIn } from "./helpers/sign-in";

// The HTTP edge as a client sees it: where sign-in sends the browser afterwards.

const DESIGNER = "dana.designer@kestrel-ridge.example";

test.describe("sign-in follows only the app's own pages", () => {
  test("a signed-in visit to /sign-in?next= redirects on-site only", async ({ page }) => {
    await signIn(page, DESIGNER);
    // Raw query values, as an attacker would put them in a link.
    const cases: [string, string][] = [
      ["/%09/evil.example", "/desk"], // decodes to "/<tab>/evil.example", which a browser reads as //evil.example
      ["//evil", "/desk"],
      ["/%5Cevil", "/desk"],
      ["/\\evil", "/desk"],
      ["https://evil.example/", "/desk"],
      ["https%3A%2F%2Fevil.example%2F", "/desk"],
      ["javascript:alert(1)", "/desk"],
      ["%2F%2Fevil.example", "/desk"],
      ["%2F%252F%2Fevil.example", "/%2F/evil.example"], // double-encoded: stays a path of ours
      ["%2Fdesigns%3Fshow%3Darchived", "/designs?show=archived"],
    ];
    for (const [query, expected] of cases) {
      const response = await page.request.get(`/sign-in?next=${query}`, { maxRedirects: 0 });
      expect(response.status(), query).toBeGreaterThanOrEqual(300);
      expect(response.status(), query).toBeLessThan(400);
      const location = new URL(response.headers()["location"] ?? "", page.url());
      expect(location.origin, query).toBe(new URL(page.url()).origin);
      expect(`${location.pathname}${location.search}`, query).toBe(expected);
    }
  });

  test("the sign-in form with next=/%09/evil.example lands on the desk", async ({ page }) => {
    await page.goto("/sign-in?next=/%09/evil.example");
    await page.getByLabel("E-mail").fill(DESIGNER);
    await page.getByLabel("Password").fill("halden-creek-2026");
    await page.getByRole("button", { name: "Sign in" }).click();
    await expect(page).toHaveURL(/\/desk$/);
  });
});
