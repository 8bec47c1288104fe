import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { appUrl, createTestTenant, ownerPool, signInCookie, TEST_PASSWORD, type TestTenant } from "@/test/tenants";
import { THROTTLE } from "./sign-in";

const pool = ownerPool();
let tenant: TestTenant;

beforeAll(async () => {
  tenant = await createTestTenant(pool, "signin");
});
afterAll(() => pool.end());

function postSession(body: unknown, headers: Record<string, string> = {}) {
  return fetch(`${appUrl}/api/v1/session`, { method: "POST", headers: { "content-type": "application/json", ...headers }, body: JSON.stringify(body) });
}

describe("JSON sign-in and sessions (§9)", () => {
  it("signs in and sets an httpOnly SameSite=Lax session cookie that opens the API", async () => {
    const response = await postSession({ email: tenant.users.engineer!.email, password: TEST_PASSWORD });
    expect(response.status).toBe(200);
    const body = await response.json();
    expect(body).toMatchObject({ user: { email: tenant.users.engineer!.email }, tenant: { id: tenant.id }, role: "engineer" });
    const setCookie = response.headers.getSetCookie().find((c) => c.startsWith("lotwarden_session="))!;
    expect(setCookie).toMatch(/HttpOnly/i);
    expect(setCookie).toMatch(/SameSite=Lax/i);
    const cookie = setCookie.split(";")[0]!;
    expect((await fetch(`${appUrl}/api/v1/customers`, { headers: { cookie } })).status).toBe(200);
  });

  it("gives the same answer for an unknown e-mail and a wrong password (threat: account enumeration)", async () => {
    const unknown = await postSession({ email: `nobody-${Date.now()}@example.test`, password: "whatever-password" });
    const wrong = await postSession({ email: tenant.users.analyst!.email, password: "not-the-password" });
    expect(unknown.status).toBe(401);
    expect(wrong.status).toBe(401);
    expect((await unknown.json()).error.message).toBe((await wrong.json()).error.message);
  });

  it("throttles repeated failures for one account, even with the right password afterwards (threat: password guessing)", async () => {
    const email = tenant.users.customer2!.email;
    for (let i = 0; i < THROTTLE.perAccount; i++) expect((await postSession({ email, password: `guess-${i}` })).status).toBe(401);
    const blocked = await postSession({ email, password: TEST_PASSWORD });
    expect(blocked.status).toBe(429);
    expect(blocked.headers.get("retry-after")).toBe(String(THROTTLE.windowMinutes * 60));
  });

  it("signs out: the cookie no longer opens the API (threat: a session that outlives sign-out)", async () => {
    const cookie = await signInCookie(tenant.users.admin!.email);
    const out = await fetch(`${appUrl}/api/v1/session`, { method: "DELETE", headers: { cookie, origin: appUrl } });
    expect(out.status).toBe(204);
    expect((await fetch(`${appUrl}/api/v1/customers`, { headers: { cookie } })).status).toBe(401);
  });

  it("refuses a cookie-authenticated change from another origin (threat: cross-site request forgery)", async () => {
    const cookie = await signInCookie(tenant.users.admin!.email);
    const response = await fetch(`${appUrl}/api/v1/customers`, {
      method: "POST",
      headers: { cookie, origin: "http://evil.example", "content-type": "application/json" },
      body: JSON.stringify({ name: "forged" }),
    });
    expect(response.status).toBe(403);
  });

  it("refuses a body that is not JSON with 415 and bad fields with 422 naming them", async () => {
    const form = await fetch(`${appUrl}/api/v1/session`, { method: "POST", headers: { "content-type": "text/plain" }, body: "x" });
    expect(form.status).toBe(415);
    const bad = await postSession({ email: "not-an-email", password: "" });
    expect(bad.status).toBe(422);
    expect((await bad.json()).error.details.map((d: { path: string }) => d.path)).toEqual(["email", "password"]);
  });
});
