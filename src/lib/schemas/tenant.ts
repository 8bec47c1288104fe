import { z } from "zod";

export const tenantSettingsSchema = z.object({
  name: z.string().trim().min(1, "Enter the tenant's name").max(200),
  errorBudgetPercent: z.coerce.number({ message: "Enter a percentage" }).min(0, "At least 0 %").max(10, "At most 10 %"),
});
