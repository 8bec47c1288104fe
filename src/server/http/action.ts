import "server-only";
import { randomUUID } from "node:crypto";
import type { z } from "zod";
import { can, type Permission } from "@/lib/permissions";
import { type AuthContext, getAuthContext } from "../auth/context";
import type { Scope } from "../db/scope";
import { AppError } from "./errors";

export type ActionResult<T> =
  | { ok: true; data: T }
  | { ok: false; message: string; fieldErrors?: Record<string, string[]> };

function formToObject(input: FormData | Record<string, unknown>): Record<string, unknown> {
  if (!(input instanceof FormData)) return input;
  const out: Record<string, unknown> = {};
  for (const [key, value] of input.entries()) {
    if (key.startsWith("$ACTION")) continue;
    out[key] = key in out ? ([] as unknown[]).concat(out[key], value) : value;
  }
  return out;
}

function fieldErrorsOf(error: z.ZodError): Record<string, string[]> {
  const fieldErrors: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.join(".") || "form";
    (fieldErrors[key] ??= []).push(issue.message);
  }
  return fieldErrors;
}

async function run<T>(fn: () => Promise<T>): Promise<ActionResult<T>> {
  try {
    return { ok: true, data: await fn() };
  } catch (error) {
    if (error instanceof AppError) return { ok: false, message: error.message };
    const id = randomUUID();
    console.error(`[${id}]`, error);
    return { ok: false, message: `Something went wrong on our side (request ${id}).` };
  }
}

/** A server action for signed-in users: parses the form with the schema, checks the permission, runs in scope. */
export function appAction<S extends z.ZodType, T>(
  schema: S,
  options: { permission: Permission },
  fn: (input: z.infer<S>, ctx: { context: AuthContext; scope: Scope }) => Promise<T>,
) {
  return async (input: FormData | Record<string, unknown>): Promise<ActionResult<T>> => {
    const context = await getAuthContext();
    if (!context) return { ok: false, message: "Your session has ended: sign in again." };
    if (!can(context.role, options.permission)) return { ok: false, message: "Your role may not do this." };
    const parsed = schema.safeParse(formToObject(input));
    if (!parsed.success) return { ok: false, message: "Please correct the marked fields.", fieldErrors: fieldErrorsOf(parsed.error) };
    return run(() => fn(parsed.data, { context, scope: context.scope }));
  };
}

/** A server action that needs no session (sign-in, accept an invitation, reset a password). */
export function publicAction<S extends z.ZodType, T>(schema: S, fn: (input: z.infer<S>) => Promise<T>) {
  return async (input: FormData | Record<string, unknown>): Promise<ActionResult<T>> => {
    const parsed = schema.safeParse(formToObject(input));
    if (!parsed.success) return { ok: false, message: "Please correct the marked fields.", fieldErrors: fieldErrorsOf(parsed.error) };
    return run(() => fn(parsed.data));
  };
}
