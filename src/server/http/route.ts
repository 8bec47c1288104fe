import "server-only";
import { timingSafeEqual } from "node:crypto";
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
