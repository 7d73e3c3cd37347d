import { z } from "zod";
import { RoleSchema } from "./roles.js";

export const PASSWORD_MIN_LENGTH = 12;

export const PasswordSchema = z
  .string({ error: "must be text" })
  .min(PASSWORD_MIN_LENGTH, `must be at least ${PASSWORD_MIN_LENGTH} characters`)
  .max(256, "must be at most 256 characters");

/** Why a record changed: every change to a regulated record carries one. */
export const ReasonSchema = z.string({ error: "is required: say why you make this change" }).trim().min(3, "must say why (at least 3 characters)").max(2000, "must be at most 2000 characters");

export const EmailSchema = z.string({ error: "is required" }).trim().toLowerCase().pipe(z.email("must be an email address")).pipe(z.string().max(254, "is too long"));

export const SignInSchema = z.object({
  email: EmailSchema,
  password: z.string({ error: "is required" }).min(1, "is required").max(256, "is too long"),
});
export type SignInInput = z.infer<typeof SignInSchema>;

export const PasswordChangeSchema = z.object({
  currentPassword: z.string({ error: "is required" }).min(1, "is required").max(256, "is too long"),
  newPassword: PasswordSchema,
});
export type PasswordChangeInput = z.infer<typeof PasswordChangeSchema>;

const RolesSchema = z.array(RoleSchema, { error: "must be a list of roles" }).min(1, "must hold at least one role").max(5).refine((r) => new Set(r).size === r.length, "must not repeat a role");

export const PersonCreateSchema = z.object({
  email: EmailSchema,
  name: z.string({ error: "is required" }).trim().min(2, "must be the person's printed name (at least 2 characters)").max(120, "is too long"),
  roles: RolesSchema,
  temporaryPassword: PasswordSchema,
  reason: ReasonSchema,
});
export type PersonCreateInput = z.infer<typeof PersonCreateSchema>;

export const PersonRolesSchema = z.object({ roles: RolesSchema, reason: ReasonSchema });
export type PersonRolesInput = z.infer<typeof PersonRolesSchema>;

export const ReasonOnlySchema = z.object({ reason: ReasonSchema });
export type ReasonOnlyInput = z.infer<typeof ReasonOnlySchema>;

export const PasswordResetSchema = z.object({ temporaryPassword: PasswordSchema, reason: ReasonSchema });
export type PasswordResetInput = z.infer<typeof PasswordResetSchema>;

/** A person as the API shows them (never the password hash). */
export interface PersonView {
  id: string;
  email: string;
  name: string;
  roles: z.infer<typeof RoleSchema>[];
  active: boolean;
  locked: boolean;
  failedSignIns: number;
  mustChangePassword: boolean;
  createdAt: string;
  lastSignInAt: string | null;
}

/** The signed-in person, as GET /api/session shows them. */
export interface SessionUser {
  id: string;
  email: string;
  name: string;
  roles: z.infer<typeof RoleSchema>[];
  mustChangePassword: boolean;
}
