"use server";

import { revalidatePath } from "next/cache";
import { customerSchema } from "@/lib/schemas/members";
import { createCustomer } from "@/server/db/queries/customers";
import { withScope } from "@/server/db/scope";
import { appAction } from "@/server/http/action";

export const createCustomerAction = appAction(customerSchema, { permission: "customers.manage" }, async ({ name }, { scope }) => {
  const customer = await withScope(scope, (tx) => createCustomer(tx, scope, name));
  revalidatePath("/settings/customers");
  return customer;
});
