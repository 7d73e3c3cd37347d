import { Outlet } from "react-router";
import type { Role } from "../api/types";
import { useSession } from "../features/session/useSession";
import { NotAvailable } from "./NotAvailable";

/** Renders the nested screens only for people holding `role`; others see a plain refusal. */
export function RequireRole({ role }: { role: Role }) {
  const { user } = useSession();
  return user?.roles.includes(role) ? <Outlet /> : <NotAvailable />;
}
