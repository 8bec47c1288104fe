import { z } from "zod";
import { ROLES, type Role } from "../permissions";

const optionalUuid = z
  .string()
  .trim()
  .transform((v) => (v === "" ? null : v))
  .pipe(z.string().uuid("Choose a customer account").nullable());

export const inviteSchema = z.object({
  email: z.string().trim().toLowerCase().email("Enter an e-mail address").max(254),
  role: z.enum(ROLES),
  customerId: optionalUuid.default(null),
});
export type Invite = z.infer<typeof inviteSchema>;

export const changeRoleSchema = z.object({ userId: z.string().uuid(), role: z.enum(ROLES), customerId: optionalUuid.default(null) });
export const memberIdSchema = z.object({ userId: z.string().uuid() });
export const invitationIdSchema = z.object({ invitationId: z.string().uuid() });

export const createApiKeySchema = z.object({
  name: z.string().trim().min(1, "Name the key after what uses it").max(100),
  role: z.enum(ROLES),
  customerId: optionalUuid.default(null),
});
export const apiKeyIdSchema = z.object({ keyId: z.string().uuid() });

export const customerSchema = z.object({ name: z.string().trim().min(1, "Enter the customer's name").max(200) });

export interface InvitationRow {
  id: string;
  email: string;
  role: Role;
  createdAt: string;
  expiresAt: string;
  state: "pending" | "accepted" | "expired" | "withdrawn";
}


export interface MemberView {
  userId: string;
  email: string;
  name: string;
  role: Role;
  customerId: string | null;
  customerName: string | null;
  joinedAt: string;
}

export interface ApiKeyView {
  id: string;
  name: string;
  role: Role;
  prefix: string;
  createdBy: string | null;
  createdAt: string;
  lastUsedAt: string | null;
  revokedAt: string | null;
}
