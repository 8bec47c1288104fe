import "server-only";
import { timingSafeEqual } from "node:crypto";
import { can, type Permission } from "@/lib/permissions";
import { type AuthContext, getAuthContext } from "../auth/context";
import type { Scope } from "../db/scope";
import { env } from "../env";
import { AppError, toErrorResponse } from "./errors";

export interface RouteArgs {
  request: Request;
  url: URL;
  params: Record<string, string>;
}

type Handler = (args: RouteArgs) => Promise<Response>;
type NextContext = { params: Promise<Record<string, string | string[]>> };

async function resolveParams(context: NextContext | undefined): Promise<Record<string, string>> {
  const raw = context ? await context.params : {};
  const params: Record<string, string> = {};
  for (const [key, value] of Object.entries(raw ?? {})) params[key] = Array.isArray(value) ? value.join("/") : value;
  return params;
}

export function wrap(body: Handler) {
  return async (request: Request, context?: NextContext): Promise<Response> => {
    try {
      return await body({ request, url: new URL(request.url), params: await resolveParams(context) });
    } catch (error) {
      return toErrorResponse(error);
    }
  };
}

/** Routes without a session (health, sign-in): the §9 error shape, nothing else. */
export function publicRoute(body: Handler) {
  return wrap(body);
}

function sameSecret(given: string, expected: string): boolean {
  const a = Buffer.from(given);
  const b = Buffer.from(expected);
  return a.length === b.length && timingSafeEqual(a, b);
}

/** Routes the background worker calls: the shared secret, compared in constant time, in every environment. */
export function internalRoute(body: Handler) {
  return wrap(async (args) => {
    const header = args.request.headers.get("authorization") ?? "";
    const given = header.startsWith("Bearer ") ? header.slice(7) : "";
    if (!sameSecret(given, env.WORKER_SECRET)) throw new AppError("unauthenticated", "Worker secret required");
    return body(args);
  });
}

export interface ApiRouteArgs extends RouteArgs {
  context: AuthContext;
  scope: Scope;
}

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/** Rejects a cookie-authenticated state change that comes from another origin (cross-site request forgery). */
export function assertSameOrigin(request: Request): void {
  if (SAFE_METHODS.has(request.method)) return;
  const origin = request.headers.get("origin");
  const allowed = new Set([new URL(env.APP_URL).origin, new URL(request.url).origin]);
  if (!origin || !allowed.has(origin)) throw new AppError("forbidden", "Cross-origin request refused");
}

/**
 * The §9 API: resolves the caller (session cookie or Bearer key), answers 401 without one and 403 when the role
 * lacks the permission, then hands the body a Scope that every query applies.
 */
export function apiRoute(options: { permission: Permission }, body: (args: ApiRouteArgs) => Promise<Response>) {
  return wrap(async (args) => {
    const context = await getAuthContext();
    if (!context) throw new AppError("unauthenticated", "Sign in or send an API key (Authorization: Bearer …)");
    if (context.via === "session") assertSameOrigin(args.request);
    if (!can(context.role, options.permission)) throw new AppError("forbidden", `Your role (${context.role}) may not do this`);
    return body({ ...args, context, scope: context.scope });
  });
}
