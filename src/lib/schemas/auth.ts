import { z } from "zod";

export const signInSchema = z.object({
  email: z.string().trim().toLowerCase().email("Enter an e-mail address").max(254),
  password: z.string().min(1, "Enter your password").max(1024),
  tenant: z.string().trim().max(100).optional(),
});
export type SignIn = z.infer<typeof signInSchema>;

export const newPasswordSchema = z
  .string()
  .min(12, "Use at least 12 characters")
  .max(1024, "Use at most 1024 characters");

export const acceptInvitationSchema = z.object({
  token: z.string().min(20).max(200),
  name: z.string().trim().min(1, "Enter your name").max(200),
  password: newPasswordSchema,
});
export type AcceptInvitation = z.infer<typeof acceptInvitationSchema>;

export const requestResetSchema = z.object({ email: z.string().trim().toLowerCase().email("Enter an e-mail address").max(254) });
export const resetPasswordSchema = z.object({ token: z.string().min(20).max(200), password: newPasswordSchema });

export const switchTenantSchema = z.object({ tenantId: z.string().uuid() });
