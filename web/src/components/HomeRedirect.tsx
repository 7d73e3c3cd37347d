import { Navigate } from "react-router";
import { homePathFor } from "../features/session/roles";
import { useSession } from "../features/session/useSession";

/** The default route: sends the person to the home of their first role. */
export function HomeRedirect() {
  const { user } = useSession();
  if (user && user.roles.length > 0) return <Navigate to={homePathFor(user.roles)} replace />;
  return (
    <section className="flex max-w-2xl flex-col gap-3">
      <h1 className="text-3xl font-bold">No roles yet</h1>
      <p>Your account has no roles, so there is nothing to show. Ask an administrator to assign the roles you need.</p>
    </section>
  );
}
