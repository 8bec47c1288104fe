import { type NextRequest, NextResponse } from "next/server";

// Not an auth boundary: every page and data call checks for itself. This only refuses cross-origin state changes
// that ride on the session cookie, and keeps the cookie's lifetime in step with the session's.
const SESSION_COOKIE = "lotwarden_session";
const SAFE = new Set(["GET", "HEAD", "OPTIONS"]);

export function proxy(request: NextRequest) {
  const cookie = request.cookies.get(SESSION_COOKIE);
  if (!SAFE.has(request.method) && cookie && !request.headers.get("authorization")) {
    const origin = request.headers.get("origin");
    const host = request.headers.get("host");
    if (!origin || !host || new URL(origin).host !== host) {
      return NextResponse.json({ error: { code: "forbidden", message: "Cross-origin request refused", details: null } }, { status: 403 });
    }
  }
  const response = NextResponse.next();
  if (request.method === "GET" && cookie && !request.nextUrl.pathname.startsWith("/api/")) {
    response.cookies.set(SESSION_COOKIE, cookie.value, {
      httpOnly: true,
      sameSite: "lax",
      secure: request.nextUrl.protocol === "https:",
      path: "/",
      maxAge: 14 * 24 * 3600,
    });
  }
  return response;
}

// The upload route is left out: Next.js buffers — and past 10 MB truncates — every body a proxy sees; the route's
// own wrapper (apiRoute) does the origin check there.
export const config = { matcher: ["/((?!_next/static|_next/image|favicon.svg|api/v1/lots/ingest).*)"] };
