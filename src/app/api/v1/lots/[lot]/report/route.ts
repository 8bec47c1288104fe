import { z } from "zod";
import { withScope } from "@/server/db/scope";
import { apiRoute } from "@/server/http/route";
import { buildLotReport } from "@/server/reports/lot-report";
import { renderLotReportPdf } from "@/server/reports/lot-report-pdf";

const querySchema = z.object({ format: z.enum(["json", "pdf"]).default("json"), include: z.enum(["maps"]).optional() });

/** The customer lot report (§9): JSON, or `format=pdf`; customers reach only their own released lots (else 404). */
export const GET = apiRoute({ permission: "reports.read" }, async ({ scope, context, params, url }) => {
  const query = querySchema.parse(Object.fromEntries(url.searchParams));
  const { report, tenantName } = await withScope(scope, async (tx) => ({
    report: await buildLotReport(tx, params.lot!),
    tenantName: (await tx.selectFrom("tenants").select("name").where("id", "=", scope.tenantId).executeTakeFirstOrThrow()).name,
  }));
  if (query.format === "pdf") {
    const pdf = await renderLotReportPdf(report, context.tenantName || tenantName);
    return new Response(new Uint8Array(pdf), {
      headers: { "content-type": "application/pdf", "content-disposition": `attachment; filename="lot-report-${report.lot}.pdf"` },
    });
  }
  const { maps, ...rest } = report;
  return Response.json(query.include === "maps" ? report : rest);
});
