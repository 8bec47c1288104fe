import "server-only";
import type { OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { signInSchema } from "@/lib/schemas/auth";
import type { SignedIn } from "../auth/sign-in";
import type { checkHealth } from "../health";
import { errors, json, JSON_BODY_ERRORS, SESSION_COOKIE_NAME } from "./components";
import { describeFields, mirrors, named, z } from "./zod-openapi";

const signInBody = named(
  "SignIn",
  describeFields(signInSchema, {
    email: "The account's e-mail address",
    password: "The account's password",
    tenant: "Tenant slug or id to sign in to; the first membership when omitted",
  }),
  "E-mail and password sign-in.",
);

const signedInSchema = mirrors<Omit<SignedIn, "cookie">>()(
  z
    .object({
      user: z.object({ id: z.string().uuid(), email: z.string(), name: z.string() }),
      tenant: z.object({ id: z.string().uuid(), slug: z.string(), name: z.string() }).describe("The tenant the session acts in"),
      role: z.string().describe("The role in that tenant: admin, engineer, analyst or customer"),
    })
    .openapi("SignedIn"),
);

const serviceState = z
  .union([z.object({ status: z.literal("up") }), z.object({ status: z.literal("down"), reason: z.string().describe("Short reason; never a URL, host or secret") })])
  .openapi("ServiceState");

const healthSchema = mirrors<Awaited<ReturnType<typeof checkHealth>> & { time: string }>()(
  z
    .object({
      status: z.enum(["ok", "degraded"]),
      services: z.object({ database: serviceState, objectStore: serviceState, mailRelay: serviceState }),
      time: z.string().describe("Server time, ISO 8601 UTC"),
    })
    .openapi("Health"),
);

const NO_AUTH: { security: [] } = { security: [] };

export function registerSessionPaths(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: "post",
    path: "/api/v1/session",
    operationId: "signIn",
    tags: ["Session"],
    summary: "Sign in",
    description: `Sets the \`${SESSION_COOKIE_NAME}\` session cookie (HttpOnly, SameSite=Lax). Unknown e-mail and wrong password get the same 401; repeated failures for an account or an address answer 429 until the throttling window passes (Retry-After gives the seconds).`,
    ...NO_AUTH,
    request: { body: { required: true, content: json(signInBody, { email: "engineer@tidewater.example", password: "<password>" }) } },
    responses: {
      200: { description: "Signed in; the response sets the session cookie", content: json(signedInSchema) },
      ...errors("unauthenticated", "forbidden", "not_found", "rate_limited", ...JSON_BODY_ERRORS),
    },
  });

  registry.registerPath({
    method: "delete",
    path: "/api/v1/session",
    operationId: "signOut",
    tags: ["Session"],
    summary: "Sign out",
    description: "Ends the session of the cookie sent, if any, and clears the cookie. Answers 204 whether or not a session was open.",
    ...NO_AUTH,
    responses: { 204: { description: "Signed out" }, ...errors("forbidden") },
  });

  registry.registerPath({
    method: "get",
    path: "/api/health",
    operationId: "getHealth",
    tags: ["Service"],
    summary: "Liveness and the state of the services",
    description: "The database, object store and mail relay, each up or down. No auth, no secrets.",
    ...NO_AUTH,
    responses: {
      200: { description: "Every service is up", content: json(healthSchema) },
      503: { description: "At least one service is down", content: json(healthSchema) },
    },
  });

  registry.registerPath({
    method: "get",
    path: "/api/openapi",
    operationId: "getOpenApiDocument",
    tags: ["Service"],
    summary: "This OpenAPI document",
    description: "OpenAPI 3.1, generated from the same zod schemas the handlers validate with.",
    ...NO_AUTH,
    responses: { 200: { description: "The document", content: { "application/json": { schema: { type: "object" } } } } },
  });
}
