import { NavLink } from "react-router";
import type { Role } from "../api/types";
import { ROLE_HOMES, ROLE_LABELS } from "../features/session/roles";

const ADMIN_PAGES = [
  { to: "/admin/people", label: "People" },
  { to: "/admin/mail", label: "Mail" },
];

const MASTER_DATA_PAGES: { to: string; label: string; roles: Role[] }[] = [
  { to: "/batches", label: "Batches", roles: ["operator", "supervisor", "quality", "engineer"] },
  { to: "/deviations", label: "Deviations", roles: ["operator", "supervisor", "quality", "engineer"] },
  { to: "/vessels", label: "Vessels", roles: ["engineer", "quality", "supervisor"] },
  { to: "/rate-models", label: "Rate models", roles: ["engineer", "quality"] },
  { to: "/master-records", label: "Master records", roles: ["engineer", "quality", "supervisor"] },
  { to: "/campaigns", label: "Campaigns", roles: ["engineer", "quality", "supervisor"] },
  { to: "/analysis", label: "Kinetics analysis", roles: ["operator", "supervisor", "quality", "engineer", "admin"] },
  { to: "/training", label: "Training", roles: ["operator", "supervisor", "quality", "engineer", "admin"] },
];

function linkClass({ isActive }: { isActive: boolean }): string {
  return `flex min-h-11 items-center rounded-md px-3 font-semibold no-underline ${
    isActive
      ? "bg-fen-700 text-white hover:text-white"
      : "text-ink-950 hover:bg-fen-50 hover:text-fen-900"
  }`;
}

/** The list of the person's role homes (and the admin's sub-pages), then the master data they use. */
export function SideNav({ roles }: { roles: readonly Role[] }) {
  const masterData = MASTER_DATA_PAGES.filter((page) => page.roles.some((role) => roles.includes(role)));
  return (
    <nav aria-label="Your work areas">
      <ul className="flex gap-1 overflow-x-auto xl:flex-col">
        {roles.map((role) => (
          <li key={role} className="flex shrink-0 gap-1 xl:block">
            <NavLink to={ROLE_HOMES[role]} end className={linkClass}>
              {ROLE_LABELS[role]}
            </NavLink>
            {role === "admin" && (
              <ul className="flex gap-1 xl:mt-1 xl:ml-4 xl:flex-col">
                {ADMIN_PAGES.map((page) => (
                  <li key={page.to}>
                    <NavLink to={page.to} className={linkClass}>
                      {page.label}
                    </NavLink>
                  </li>
                ))}
              </ul>
            )}
          </li>
        ))}
        {masterData.map((page) => (
          <li key={page.to} className="shrink-0">
            <NavLink to={page.to} className={linkClass}>
              {page.label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}
