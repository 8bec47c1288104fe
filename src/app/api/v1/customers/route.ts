import { customerSchema } from "@/lib/schemas/members";
import { createCustomer, listCustomers } from "@/server/db/queries/customers";
import { withScope } from "@/server/db/scope";
import { apiRoute } from "@/server/http/route";
import { readJson } from "@/server/http/body";

export const GET = apiRoute({ permission: "tenant.read" }, async ({ scope }) => Response.json({ customers: await withScope(scope, (tx) => listCustomers(tx, scope)) }));

export const POST = apiRoute({ permission: "customers.manage" }, async ({ request, scope }) => {
  const input = customerSchema.parse(await readJson(request));
  const customer = await withScope(scope, (tx) => createCustomer(tx, scope, input.name));
  return Response.json(customer, { status: 201 });
});
