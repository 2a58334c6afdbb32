import { readdirSync, readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { API_CONTENT_SECURITY_POLICY, SECURITY_HEADERS, pageContentSecurityPolicy } from "@/proxy";

// The policy itself (the HTTP and browser checks are in e2e/edge-security.spec.ts).
describe("security headers", () => {
  it("a page's policy allows only nonced scripts and has no unsafe-inline for scripts or <style>", () => {
    const policy = pageContentSecurityPolicy("abc123");
    const directives = Object.fromEntries(
      policy.split("; ").map((d) => [d.split(" ")[0], d.split(" ").slice(1).join(" ")]),
    );
    expect(directives["script-src"]).toBe("'self' 'nonce-abc123' 'strict-dynamic'");
    expect(directives["style-src"]).toBe("'self' 'nonce-abc123'");
    expect(directives["style-src-attr"]).toBe("'unsafe-inline'");
    expect(directives["frame-ancestors"]).toBe("'none'");
    expect(directives["object-src"]).toBe("'none'");
    expect(directives["worker-src"]).toBe("'self'");
    expect(policy).not.toMatch(/unsafe-eval|https?:|\*/);
    expect(pageContentSecurityPolicy("n", true)).toContain("'unsafe-eval'");
    expect(API_CONTENT_SECURITY_POLICY).toContain("default-src 'none'");
    expect(SECURITY_HEADERS["x-frame-options"]).toBe("DENY");
  });

  it("every browser spec uses the shared fixture that fails on CSP violations", () => {
    const specs = readdirSync("e2e").filter((f) => f.endsWith(".spec.ts"));
    expect(specs.length).toBeGreaterThan(5);
    for (const spec of specs) {
      const text = readFileSync(`e2e/${spec}`, "utf8");
      expect(text, spec).toMatch(/from "\.\/helpers\/test";/);
      expect(text, spec).not.toMatch(/import \{[^}]*\btest\b[^}]*\} from "@playwright\/test"/);
    }
  });
});
