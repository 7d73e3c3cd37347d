import type { ReactNode } from "react";
import type { Role } from "../api/types";
import { ROLE_LABELS } from "../features/session/roles";
import { useSession } from "../features/session/useSession";
import { Notice } from "./Notice";

/** Shows `children` to holders of `role`; others read why they cannot act here. */
export function RoleGate({ role, children }: { role: Role; children: ReactNode }) {
  const { user } = useSession();
  if (user?.roles.includes(role)) return <>{children}</>;
  return <Notice>This needs the {ROLE_LABELS[role]} role, which your account does not hold.</Notice>;
}
