import { describe, expect, it } from "vitest";
import { isSameOriginPost } from "~/utils/origin.server";
import { securityHeaders } from "~/utils/security-headers.server";

describe("security headers", () => {
  const headers = securityHeaders({ nonce: "abc123", production: true });

  it("allows scripts only from our origin or with the response's nonce", () => {
    const csp = headers["Content-Security-Policy"]!;
    expect(csp).toContain("script-src 'self' 'nonce-abc123'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("object-src 'none'");
    expect(csp).not.toMatch(/script-src[^;]*unsafe-inline/);
  });

  it("sets the rest of the table", () => {
    expect(headers["X-Content-Type-Options"]).toBe("nosniff");
    expect(headers["X-Frame-Options"]).toBe("DENY");
    expect(headers["Referrer-Policy"]).toBe("strict-origin-when-cross-origin");
    expect(headers["Cache-Control"]).toBe("private, no-store");
  });

  it("leaves CSP off for the dev server only", () => {
    expect(securityHeaders({ nonce: "x", production: false })["Content-Security-Policy"]).toBeUndefined();
  });
});

describe("origin check on posts", () => {
  const post = (headers: Record<string, string>) =>
    new Request("http://localhost:3000/team", { method: "POST", headers: { Cookie: "sw_session=x", ...headers } });

  it("accepts a post from our own page", () => {
    expect(isSameOriginPost(post({ Host: "localhost:3000", Origin: "http://localhost:3000" }))).toBe(true);
  });
  it("refuses a post from another site, or with no origin at all", () => {
    expect(isSameOriginPost(post({ Host: "localhost:3000", Origin: "http://evil.example" }))).toBe(false);
    expect(isSameOriginPost(post({ Host: "localhost:3000" }))).toBe(false);
    expect(isSameOriginPost(post({ Host: "localhost:3000", Origin: "null" }))).toBe(false);
  });
  it("falls back to the Referer when a browser sends no Origin", () => {
    expect(isSameOriginPost(post({ Host: "localhost:3000", Referer: "http://localhost:3000/team" }))).toBe(true);
  });
  it("lets a post without a cookie through: there is no session to forge, the route's guard answers it", () => {
    expect(
      isSameOriginPost(new Request("http://localhost:3000/api/v1/estimate", { method: "POST", headers: { Host: "localhost:3000" } })),
    ).toBe(true);
  });
  it("refuses a cross-site post even without a cookie (no forged sign-in)", () => {
    expect(
      isSameOriginPost(
        new Request("http://localhost:3000/login", { method: "POST", headers: { Host: "localhost:3000", Origin: "http://evil.example" } }),
      ),
    ).toBe(false);
  });
  it("lets reads through", () => {
    expect(isSameOriginPost(new Request("http://localhost:3000/team"))).toBe(true);
  });
});
