import "server-only";
import { sql } from "kysely";
import { listUserMemberships } from "../db/queries/memberships";
import { withGlobal, withUser } from "../db/scope";
import { AppError } from "../http/errors";
import { verifyPassword } from "./secrets";
import { type CookieSpec, createSession } from "./session";

// Throttling kept in PostgreSQL, so it holds across processes and restarts (common practice for the numbers).
export const THROTTLE = { windowMinutes: 15, perAccount: 5, perAddress: 30 } as const;
const WRONG = "E-mail or password is wrong.";

async function recentFailures(column: "email" | "address", value: string): Promise<number> {
  const row = await withGlobal((tx) =>
    tx
      .selectFrom("security_events")
      .select((eb) => eb.fn.countAll<string>().as("n"))
      .where("kind", "=", "sign_in")
      .where("success", "=", false)
      .where(column, "=", value)
      .where("at", ">", sql<Date>`now() - make_interval(mins => ${THROTTLE.windowMinutes})`)
      .executeTakeFirstOrThrow(),
  );
  return Number(row.n);
}

function record(email: string, address: string, userId: string | null, success: boolean) {
  return withGlobal((tx) => tx.insertInto("security_events").values({ kind: "sign_in", email, address, user_id: userId, success }).execute());
}

/**
 * Signs in with e-mail and password. Unknown e-mail and wrong password get the same message and the same work;
 * too many failures for the account or the address answer 429 until the window passes.
 */
export interface SignedIn {
  cookie: CookieSpec;
  user: { id: string; email: string; name: string };
  tenant: { id: string; slug: string; name: string };
  role: string;
}

export async function signIn(input: { email: string; password: string; tenant?: string | undefined }, address: string): Promise<SignedIn> {
  const email = input.email.trim().toLowerCase();
  if ((await recentFailures("email", email)) >= THROTTLE.perAccount || (await recentFailures("address", address)) >= THROTTLE.perAddress) {
    await record(email, address, null, false);
    throw new AppError("rate_limited", `Too many failed sign-ins. Try again in ${THROTTLE.windowMinutes} minutes.`, null, {
      "retry-after": String(THROTTLE.windowMinutes * 60),
    });
  }
  const user = await withGlobal((tx) =>
    tx.selectFrom("users").select(["id", "email", "name", "password_hash"]).where(sql`lower(email)`, "=", email).executeTakeFirst(),
  );
  const valid = await verifyPassword(user?.password_hash ?? null, input.password);
  const memberships = user && valid ? await withUser(user.id, (tx) => listUserMemberships(tx, user.id)) : [];
  if (!user || !valid || memberships.length === 0) {
    await record(email, address, user?.id ?? null, false);
    throw new AppError("unauthenticated", WRONG);
  }
  const wanted = input.tenant ? memberships.find((m) => m.tenantSlug === input.tenant || m.tenantId === input.tenant) : memberships[0];
  if (!wanted) throw new AppError("not_found", "You are not a member of that tenant.");
  await record(email, address, user.id, true);
  return {
    cookie: await createSession(user.id, wanted.tenantId),
    user: { id: user.id, email: user.email, name: user.name },
    tenant: { id: wanted.tenantId, slug: wanted.tenantSlug, name: wanted.tenantName },
    role: wanted.role,
  };
}

/** The client address as the app sees it: the first X-Forwarded-For hop when a proxy sets one. */
export function clientAddress(headers: Headers): string {
  return headers.get("x-forwarded-for")?.split(",")[0]?.trim() || headers.get("x-real-ip") || "direct";
}
