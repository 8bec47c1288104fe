import { z } from "zod";
import { getJob } from "@/server/db/queries/jobs";
import { withScope } from "@/server/db/scope";
import { AppError } from "@/server/http/errors";
import { apiRoute } from "@/server/http/route";

export const GET = apiRoute({ permission: "data.read" }, async ({ scope, params }) => {
  const id = z.string().uuid().safeParse(params.id);
  if (!id.success) throw new AppError("not_found", "Job not found");
  return Response.json(await withScope(scope, (tx) => getJob(tx, id.data)));
});
