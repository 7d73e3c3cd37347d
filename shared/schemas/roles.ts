import { z } from "zod";

/** The roles a person may hold; a person may hold several. */
export const ROLES = ["operator", "supervisor", "quality", "engineer", "admin"] as const;
export const RoleSchema = z.enum(ROLES);
export type Role = z.infer<typeof RoleSchema>;
