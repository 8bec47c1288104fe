// The demo seed of `npm start` (§11): invented tenants, people, products and three months of probe lots, loaded
// through the real path — the ingest API, the object store, the job queue and the worker — not straight inserts.
// Idempotent: tenants and people are made once; products are created only when missing; a lot file already
// uploaded is recognised by its bytes and answers its first job.
import { createHash, randomBytes } from "node:crypto";
import { hash } from "@node-rs/argon2";
import pg from "pg";
import { createRng, demoScenario, generateLotCsv, type DemoScenario, type LotPlan } from "../../fixtures/demo";
import { asTenant } from "./owner-db";
import { log } from "./processes";

export const DEMO_PASSWORD = "warden-demo-2026";
const SEED_KEY_NAME = "Demo seed (npm start)";

/** Tenants, customers, people and memberships: the platform's own set-up, done once as the schema owner. */
async function ensurePeople(pool: pg.Pool, scenario: DemoScenario): Promise<Map<string, { id: string; customers: Map<string, string>; key: string }>> {
  const passwordHash = await hash(DEMO_PASSWORD);
  const tenants = new Map<string, { id: string; customers: Map<string, string>; key: string }>();
  for (const t of scenario.tenants) {
    const found = await pool.query("select id from tenants where slug = $1", [t.slug]).catch(() => ({ rows: [] as { id: string }[] }));
    const id: string = found.rows[0]?.id ?? (await pool.query("select gen_random_uuid() as id")).rows[0].id;
    const prefix = randomBytes(5).toString("hex");
    const secret = randomBytes(32).toString("base64url");
    const key = `lw_${prefix}_${secret}`;
    const customers = await asTenant(pool, id, async (c) => {
      await c.query("insert into tenants (id, slug, name) values ($1, $2, $3) on conflict (slug) do nothing", [id, t.slug, t.name]);
      for (const customer of t.customers) await c.query("insert into customers (tenant_id, name) values ($1, $2) on conflict (tenant_id, name) do nothing", [id, customer.name]);
      const rows = await c.query("select id, name from customers where tenant_id = $1", [id]);
      await c.query("update api_keys set revoked_at = now() where tenant_id = $1 and name = $2 and revoked_at is null", [id, SEED_KEY_NAME]);
      await c.query("insert into api_keys (tenant_id, name, role, prefix, secret_hash) values ($1, $2, 'admin', $3, $4)", [id, SEED_KEY_NAME, prefix, createHash("sha256").update(secret).digest("hex")]);
      return new Map<string, string>(rows.rows.map((r) => [r.name, r.id]));
    });
    tenants.set(t.slug, { id, customers, key });
  }
  for (const user of scenario.users) {
    const existing = await pool.query("select id from users where lower(email) = lower($1)", [user.email]);
    const userId: string =
      existing.rows[0]?.id ??
      (await pool.query("insert into users (email, name, password_hash, password_changed_at) values ($1, $2, $3, now()) returning id", [user.email, user.displayName, passwordHash])).rows[0].id;
    for (const m of user.memberships) {
      const tenant = tenants.get(m.tenantSlug)!;
      const customerId = m.customerName ? tenant.customers.get(m.customerName)! : null;
      await asTenant(pool, tenant.id, (c) =>
        c.query("insert into memberships (tenant_id, user_id, role, customer_id) values ($1, $2, $3, $4) on conflict (tenant_id, user_id) do nothing", [tenant.id, userId, m.role, customerId]),
      );
    }
  }
  return tenants;
}

interface SeedContext {
  appUrl: string;
  key: string;
}

async function call(ctx: SeedContext, method: string, path: string, body?: unknown, contentType = "application/json"): Promise<{ status: number; json: any }> {
  const response = await fetch(`${ctx.appUrl}${path}`, {
    method,
    headers: { authorization: `Bearer ${ctx.key}`, ...(body !== undefined ? { "content-type": contentType } : {}) },
    body: body === undefined ? undefined : typeof body === "string" ? body : JSON.stringify(body),
  });
  const text = await response.text();
  let json: unknown = null;
  try {
    json = text ? JSON.parse(text) : null;
  } catch {
    json = { raw: text.slice(0, 200) };
  }
  return { status: response.status, json };
}

async function waitForJob(ctx: SeedContext, id: string): Promise<any> {
  for (;;) {
    const { json } = await call(ctx, "GET", `/api/v1/jobs/${id}`);
    if (json?.status === "done" || json?.status === "failed") return json;
    await new Promise((r) => setTimeout(r, 150));
  }
}

async function ingest(ctx: SeedContext, scenario: DemoScenario, lot: LotPlan): Promise<any> {
  const product = scenario.products.find((p) => p.settings.code === lot.productCode)!;
  const csv = generateLotCsv(lot, product, createRng(lot.seed));
  const { status, json } = await call(ctx, "POST", `/api/v1/lots/ingest?filename=${encodeURIComponent(`${lot.lotNumber}.csv`)}`, csv, "text/csv");
  if (status !== 202 && status !== 200) return { status: "refused", error: json?.error };
  return status === 200 && json.job.status !== "queued" && json.job.status !== "running" ? json.job : waitForJob(ctx, json.job.id);
}

async function freezeLimits(ctx: SeedContext, productCode: string, lots: string[], inForceFrom: string): Promise<void> {
  const path = `/api/v1/products/${encodeURIComponent(productCode)}/limits`;
  const existing = await call(ctx, "GET", path);
  if (existing.status !== 200) throw new Error(`limits of ${productCode}: ${existing.status} ${JSON.stringify(existing.json)}`);
  if ((existing.json?.versions ?? []).length > 0) return;
  const frozen = await call(ctx, "POST", path, { lots, inForceFrom, note: "Demo scenario baseline" });
  if (frozen.status !== 201 && frozen.status !== 200) throw new Error(`freezing limits of ${productCode}: ${frozen.status} ${JSON.stringify(frozen.json)}`);
  log(`demo: limits of ${productCode} frozen from ${lots.length} baseline lots (version ${frozen.json?.version})`);
}

async function dispose(ctx: SeedContext, lot: LotPlan): Promise<void> {
  const plan = lot.disposition!;
  const target = { hold: "on hold", release: "released", scrap: "scrapped" }[plan.action];
  const current = await call(ctx, "GET", `/api/v1/lots/${encodeURIComponent(lot.lotNumber)}`);
  if (current.json?.status === target) return;
  const body = { action: plan.action, reason: plan.reason, ...(plan.action === "release" ? { overrideReason: `Demo scenario: ${plan.reason}` } : {}) };
  const result = await call(ctx, "POST", `/api/v1/lots/${encodeURIComponent(lot.lotNumber)}/disposition`, body);
  if (result.status >= 300) log(`demo: ${plan.action} of ${lot.lotNumber} refused: ${JSON.stringify(result.json?.error ?? result.json)}`);
}

/** Loads the demo scenario through the app at appUrl. */
export async function seedDemo(env: Record<string, string>): Promise<void> {
  const started = Date.now();
  const scenario = demoScenario();
  const pool = new pg.Pool({ connectionString: env.MIGRATION_DATABASE_URL, max: 2 });
  try {
    const tenants = await ensurePeople(pool, scenario);
    const contexts = new Map([...tenants].map(([slug, t]) => [slug, { appUrl: env.APP_URL!, key: t.key }]));
    for (const product of scenario.products) {
      const ctx = contexts.get(product.tenantSlug)!;
      if ((await call(ctx, "GET", `/api/v1/products/${product.settings.code}`)).status === 200) continue;
      const { customerName, ...settings } = product.settings;
      const customerId = tenants.get(product.tenantSlug)!.customers.get(customerName) ?? null;
      const unit = product.settings.code.startsWith("VD-") ? "G0" : "uS";
      const created = await call(ctx, "POST", "/api/v1/products", { ...settings, customerId, displayUnit: unit, deviceModel: product.deviceModel });
      if (created.status !== 201) throw new Error(`product ${product.settings.code}: ${created.status} ${JSON.stringify(created.json)}`);
    }
    let done = 0;
    for (const lot of scenario.lots) {
      const ctx = contexts.get(lot.tenantSlug)!;
      const job = await ingest(ctx, scenario, lot);
      if (job.status !== "done") log(`demo lot ${lot.lotNumber} did not ingest: ${JSON.stringify(job.error)}`);
      done++;
      if (done % 10 === 0) log(`demo: ${done}/${scenario.lots.length} lots ingested`);
      // Limits are frozen right after their baseline, so every later lot is judged on arrival, as in a fab.
      for (const plan of scenario.limitBaselines.filter((b) => b.lotNumbers.at(-1) === lot.lotNumber)) await freezeLimits(ctx, plan.productCode, plan.lotNumbers, plan.frozenAt);
    }
    for (const lot of scenario.lots.filter((l) => l.disposition)) await dispose(contexts.get(lot.tenantSlug)!, lot);
    const bad = await ingest(contexts.get(scenario.badFile.lot.tenantSlug)!, scenario, scenario.badFile.lot);
    log(`demo: the deliberately bad file was refused as planned: ${bad.error?.message ?? bad.status}`);
    log(`demo data ready in ${((Date.now() - started) / 1000).toFixed(0)} s (${scenario.totals.lots} lots, ${scenario.totals.dies} dies; all invented)`);
  } finally {
    await pool.end();
  }
}
