import { expect, test } from "./helpers/test";
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

// The security headers, as a client receives them, on a page, an API response and a download.
const COMMON = {
  "x-frame-options": "DENY",
  "x-content-type-options": "nosniff",
  "referrer-policy": "strict-origin-when-cross-origin",
};

function expectCommonHeaders(headers: Record<string, string>, label: string) {
  for (const [name, value] of Object.entries(COMMON)) expect(headers[name], `${label}: ${name}`).toBe(value);
  expect(headers["permissions-policy"], label).toContain("camera=()");
  expect(headers["permissions-policy"], label).toContain("geolocation=()");
  expect(headers["content-security-policy"], label).toContain("frame-ancestors 'none'");
}

test.describe("security headers", () => {
  test("a page gets a fresh nonce-based policy, and Next's scripts carry that nonce", async ({ request }) => {
    const first = await request.get("/sign-in");
    const second = await request.get("/sign-in");
    expect(first.status()).toBe(200);
    expectCommonHeaders(first.headers(), "page");
    const policy = first.headers()["content-security-policy"];
    const nonce = /'nonce-([A-Za-z0-9+/=]+)'/.exec(policy)?.[1];
    expect(nonce, policy).toBeTruthy();
    expect(policy).toContain(`script-src 'self' 'nonce-${nonce}' 'strict-dynamic'`);
    expect(policy).not.toContain("unsafe-eval");
    expect(policy).toMatch(/object-src 'none'/);
    expect(second.headers()["content-security-policy"]).not.toContain(nonce!);
    const html = await first.text();
    const scripts = html.match(/<script\b[^>]*>/g) ?? [];
    expect(scripts.length).toBeGreaterThan(0);
    for (const tag of scripts) expect(tag).toContain(`nonce="${nonce}"`);
  });

  test("the landing page is rendered per request too (no prerendered page without a nonce)", async ({
    request,
  }) => {
    const response = await request.get("/");
    const nonce = /'nonce-([^']+)'/.exec(response.headers()["content-security-policy"])?.[1];
    expect(await response.text()).toContain(`nonce="${nonce}"`);
  });

  test("API responses and downloads carry the headers and a policy that loads nothing", async ({ page }) => {
    const anonymous = await page.request.get("/api/v1/me");
    expect(anonymous.status()).toBe(401);
    expectCommonHeaders(anonymous.headers(), "API 401");
    expect(anonymous.headers()["content-security-policy"]).toContain("default-src 'none'");
    // API routes skip proxy.ts: the route handlers answer with the request id themselves.
    expect(anonymous.headers()["x-request-id"]).toMatch(/^[0-9a-f-]{36}$/);
    const health = await page.request.get("/api/health", { headers: { "x-request-id": "edge-probe-0001" } });
    expect(health.headers()["x-request-id"]).toBe("edge-probe-0001");
    expectCommonHeaders(health.headers(), "health");

    await signIn(page, DESIGNER);
    const list = await page.request.get("/api/v1/designs");
    expectCommonHeaders(list.headers(), "API JSON");
    const { items } = (await list.json()) as { items: { designId: string; revisionNumber: number }[] };
    const base = `/api/v1/designs/${items[0].designId}/revisions/${items[0].revisionNumber}`;
    for (const file of ["holes.csv", "drilling.dxf", "sheet.pdf"]) {
      const download = await page.request.get(`${base}/${file}`);
      expect(download.status(), file).toBe(200);
      expect(download.headers()["content-disposition"], file).toMatch(/^attachment;/);
      expectCommonHeaders(download.headers(), file);
      expect(download.headers()["content-security-policy"], file).toContain("default-src 'none'");
    }
  });

  test("the CSP fixture catches a violation (so a clean run means something)", async ({
    page,
    cspViolations,
  }) => {
    await page.goto("/sign-in");
    // A parser-inserted inline handler: 'strict-dynamic' trusts scripts created by script, not markup.
    await page.evaluate(() => {
      document.body.insertAdjacentHTML(
        "beforeend",
        '<img src="/missing.png" onerror="window.__injected = true">',
      );
    });
    await expect.poll(() => cspViolations.length).toBeGreaterThan(0);
    expect(await page.evaluate(() => (window as { __injected?: boolean }).__injected)).toBeUndefined();
    expect(cspViolations.join("\n")).toMatch(/script-src/);
    cspViolations.length = 0; // expected here; every other test fails on any
  });
});
