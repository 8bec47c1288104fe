import { cookies } from "next/headers";
import { signInSchema } from "@/lib/schemas/auth";
import { getAuthContext } from "@/server/auth/context";
import { blankSessionCookie, invalidateSession } from "@/server/auth/session";
import { clientAddress, signIn } from "@/server/auth/sign-in";
import { readJson } from "@/server/http/body";
import { assertSameOrigin, publicRoute } from "@/server/http/route";

export const POST = publicRoute(async ({ request }) => {
  const input = signInSchema.parse(await readJson(request));
  const { cookie, user, tenant, role } = await signIn(input, clientAddress(request.headers));
  (await cookies()).set(cookie.name, cookie.value, cookie.attributes);
  return Response.json({ user, tenant, role });
});

export const DELETE = publicRoute(async ({ request }) => {
  const context = await getAuthContext();
  if (context?.via === "session") {
    assertSameOrigin(request);
    if (context.sessionId) await invalidateSession(context.sessionId);
  }
  const blank = blankSessionCookie();
  (await cookies()).set(blank.name, blank.value, blank.attributes);
  return new Response(null, { status: 204 });
});
