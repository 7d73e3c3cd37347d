import { Link } from "react-router";
import { PageIntro } from "../components/PageIntro";
import { AuditIntegrityPanel } from "../features/audit/AuditIntegrityPanel";

const ADMIN_AREAS = [
  { to: "/admin/people", title: "People", text: "Create accounts, assign roles, unlock, deactivate and reset passwords." },
  { to: "/admin/mail", title: "Mail", text: "See what Isobatch has queued and sent, and what the local mail catcher received." },
];

/** The administrator's home: links to account and mail administration. */
export default function AdminHome() {
  return (
    <div className="flex flex-col gap-6">
      <PageIntro title="Administrator">
        <p>Manage who can use Isobatch and check that its mail goes out. Every change asks for a reason and is kept in the audit trail.</p>
      </PageIntro>
      <ul className="grid gap-4 lg:grid-cols-2">
        {ADMIN_AREAS.map((area) => (
          <li key={area.to}>
            <Link
              to={area.to}
              className="block min-h-11 rounded-lg border-2 border-ink-200 bg-white p-5 text-ink-950 no-underline hover:border-fen-700 hover:text-ink-950"
            >
              <span className="block text-xl font-bold text-fen-700 underline underline-offset-2">{area.title}</span>
              <span className="mt-1 block">{area.text}</span>
            </Link>
          </li>
        ))}
      </ul>
      <AuditIntegrityPanel />
    </div>
  );
}
