import { checkHealth } from "@/server/health";
import { publicRoute } from "@/server/http/route";

export const dynamic = "force-dynamic";

export const GET = publicRoute(async () => {
  const health = await checkHealth();
  return Response.json({ ...health, time: new Date().toISOString() }, { status: health.status === "ok" ? 200 : 503 });
});
