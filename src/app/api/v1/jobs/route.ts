import { jobListSchema } from "@/lib/schemas/ingest";
import { listJobs } from "@/server/db/queries/jobs";
import { withScope } from "@/server/db/scope";
import { apiRoute } from "@/server/http/route";

export const GET = apiRoute({ permission: "data.read" }, async ({ scope, url }) => {
  const filter = jobListSchema.parse(Object.fromEntries(url.searchParams));
  return Response.json({ jobs: await withScope(scope, (tx) => listJobs(tx, filter)) });
});
