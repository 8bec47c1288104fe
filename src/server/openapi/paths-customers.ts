import "server-only";
import type { OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { customerSchema } from "@/lib/schemas/members";
import type { Customer } from "../db/queries/customers";
import { access, AUTH_ERRORS, errors, json, JSON_BODY_ERRORS } from "./components";
import { describeFields, mirrors, named, z } from "./zod-openapi";

const customerResponse = mirrors<Customer>()(z.object({ id: z.string().uuid(), name: z.string() }).openapi("Customer"));
const newCustomerBody = named("NewCustomer", describeFields(customerSchema, { name: "The customer's name, unique in the tenant" }), "A new customer account.");

export function registerCustomerPaths(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: "get",
    path: "/api/v1/customers",
    operationId: "listCustomers",
    tags: ["Customers"],
    summary: "List customer accounts",
    description: "A customer caller sees only their own account.",
    ...access("tenant.read"),
    responses: {
      200: { description: "The accounts, by name", content: json(z.object({ customers: z.array(customerResponse) }).openapi("CustomerList")) },
      ...errors(...AUTH_ERRORS),
    },
  });

  registry.registerPath({
    method: "post",
    path: "/api/v1/customers",
    operationId: "createCustomer",
    tags: ["Customers"],
    summary: "Create a customer account",
    ...access("customers.manage"),
    request: { body: { required: true, content: json(newCustomerBody, { name: "Vellacourt Devices" }) } },
    responses: { 201: { description: "Created", content: json(customerResponse) }, ...errors(...AUTH_ERRORS, "conflict", ...JSON_BODY_ERRORS) },
  });
}
