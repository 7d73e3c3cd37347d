import { z } from "zod";
import { ROLES } from "../../api/types";
import { passwordSchema } from "../../lib/passwordRules";

/** Every account change is a regulated record, so it must say why. */
export const reasonSchema = z
  .string()
  .trim()
  .min(3, "Give the reason for this change. It is kept in the audit trail.");

/** At least one role from the fixed list. */
export const rolesSchema = z.array(z.enum(ROLES)).min(1, "Choose at least one role.");

/** The create-person form. */
export const createPersonSchema = z.object({
  name: z.string().trim().min(1, "Enter the person's full name."),
  email: z
    .string()
    .trim()
    .min(1, "Enter the person's email address.")
    .pipe(z.email("Enter a valid email address.")),
  roles: rolesSchema,
  temporaryPassword: passwordSchema,
  reason: reasonSchema,
});

export type CreatePersonValues = z.infer<typeof createPersonSchema>;

/** The assign-roles form. */
export const assignRolesSchema = z.object({ roles: rolesSchema, reason: reasonSchema });

/** Forms that need only a reason (deactivate, reactivate, unlock). */
export const reasonOnlySchema = z.object({ reason: reasonSchema });

/** The reset-password form. */
export const resetPasswordSchema = z.object({
  temporaryPassword: passwordSchema,
  reason: reasonSchema,
});
