// Test set-up: tenants, customers, users and API keys made directly in the database as the schema owner
// (standing in for the demo seed), each with unique names so test files never collide.
import { createHash, randomBytes, randomUUID } from "node:crypto";
import { hash } from "@node-rs/argon2";
import pg from "pg";
import { asTenant } from "../cli/owner-db";

export const TEST_PASSWORD = "correct-horse-battery-staple";
let passwordHash: Promise<string> | null = null;

export function ownerPool(): pg.Pool {
  const url = process.env.MIGRATION_DATABASE_URL ?? process.env.DATABASE_URL;
  if (!url) throw new Error("MIGRATION_DATABASE_URL is not set: run the tests with `npm test`");
  return new pg.Pool({ connectionString: url, max: 2 });
}

export type TestRole = "admin" | "engineer" | "analyst" | "customer";

export interface TestTenant {
  id: string;
  slug: string;
  name: string;
  customers: { id: string; name: string }[];
  users: Record<string, { id: string; email: string }>;
  keys: Record<string, string>;
}

function apiKey(): { key: string; prefix: string; secretHash: string } {
  const prefix = randomBytes(8).toString("hex").slice(0, 10);
  const secret = randomBytes(32).toString("base64url");
  return { key: `lw_${prefix}_${secret}`, prefix, secretHash: createHash("sha256").update(secret).digest("hex") };
}

/**
 * A tenant with two customers and one user and one API key per role: admin, engineer, analyst, customer (of the
 * first customer) and customer2 (of the second).
 */
export async function createTestTenant(pool: pg.Pool, label = "t"): Promise<TestTenant> {
  passwordHash ??= hash(TEST_PASSWORD);
  const suffix = randomUUID().slice(0, 8);
  const id = randomUUID();
  const tenant: TestTenant = { id, slug: `${label}-${suffix}`, name: `Test fab ${label} ${suffix}`, customers: [], users: {}, keys: {} };
  await asTenant(pool, id, async (c) => {
    await c.query("insert into tenants (id, slug, name) values ($1, $2, $3)", [id, tenant.slug, tenant.name]);
    for (const name of [`Customer A ${suffix}`, `Customer B ${suffix}`]) {
      const row = await c.query("insert into customers (tenant_id, name) values ($1, $2) returning id", [id, name]);
      tenant.customers.push({ id: row.rows[0].id, name });
    }
    const roles: [string, TestRole, string | null][] = [
      ["admin", "admin", null],
      ["engineer", "engineer", null],
      ["analyst", "analyst", null],
      ["customer", "customer", tenant.customers[0]!.id],
      ["customer2", "customer", tenant.customers[1]!.id],
    ];
    for (const [key, role, customerId] of roles) {
      const email = `${key}.${suffix}@${label}.test`;
      const user = await c.query("insert into users (email, name, password_hash) values ($1, $2, $3) returning id", [email, `${key} ${suffix}`, await passwordHash]);
      await c.query("insert into memberships (tenant_id, user_id, role, customer_id) values ($1, $2, $3, $4)", [id, user.rows[0].id, role, customerId]);
      tenant.users[key] = { id: user.rows[0].id, email };
      const k = apiKey();
      await c.query("insert into api_keys (tenant_id, name, role, customer_id, prefix, secret_hash) values ($1, $2, $3, $4, $5, $6)", [id, `${key} key`, role, customerId, k.prefix, k.secretHash]);
      tenant.keys[key] = k.key;
    }
  });
  return tenant;
}

export const appUrl = process.env.LOTWARDEN_TEST_APP_URL ?? "http://127.0.0.1:3100";

/** Signs in through the JSON API and returns the Cookie header value. */
export async function signInCookie(email: string, password = TEST_PASSWORD, tenant?: string): Promise<string> {
  const response = await fetch(`${appUrl}/api/v1/session`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ email, password, tenant }),
  });
  if (response.status !== 200) throw new Error(`sign-in of ${email} answered ${response.status}: ${await response.text()}`);
  const cookie = response.headers.getSetCookie().find((c) => c.startsWith("lotwarden_session="));
  if (!cookie) throw new Error("no session cookie");
  return cookie.split(";")[0]!;
}
