import { Link, useNavigate } from "react-router";
import type { SessionUser } from "../api/types";
import { useSignOutMutation } from "../features/session/mutations";
import { describeRoles } from "../features/session/roles";
import { Button } from "./Button";

/** The bar across the top: product name, who is signed in, account links and sign-out. */
export function TopBar({ user, showAccountLinks }: { user: SessionUser; showAccountLinks: boolean }) {
  const navigate = useNavigate();
  const signOut = useSignOutMutation();

  const handleSignOut = () => {
    signOut.mutate(undefined, {
      onSettled: () => navigate("/sign-in", { replace: true }),
    });
  };

  return (
    <header className="on-dark bg-ink-900 text-white">
      <div className="mx-auto flex max-w-7xl flex-wrap items-center justify-between gap-x-6 gap-y-2 px-5 py-2">
        <Link
          to="/"
          className="flex min-h-11 items-center text-2xl font-bold tracking-wide text-white no-underline hover:text-fen-100"
        >
          Isobatch
        </Link>
        <div className="flex flex-wrap items-center gap-x-5 gap-y-2" aria-label="Your account" role="group">
          <p className="leading-tight">
            <span className="block font-semibold">{user.name}</span>
            <span className="block text-[0.9rem] text-fen-200">{describeRoles(user.roles)}</span>
          </p>
          {showAccountLinks && (
            <Link
              to="/change-password"
              className="flex min-h-11 items-center text-white hover:text-fen-100"
            >
              Change password
            </Link>
          )}
          <Button
            variant="secondary"
            onClick={handleSignOut}
            busy={signOut.isPending}
            className="border-white"
          >
            Sign out
          </Button>
        </div>
      </div>
    </header>
  );
}
