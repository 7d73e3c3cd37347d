import { useEffect, useRef } from "react";
import { useIsMutating } from "@tanstack/react-query";
import { Navigate, Outlet, useLocation } from "react-router";
import { sessionKeys } from "../features/session/queries";
import { useSession } from "../features/session/useSession";
import { Button } from "./Button";
import { CalmError } from "./CalmError";
import { SideNav } from "./SideNav";
import { TopBar } from "./TopBar";

const CHANGE_PASSWORD_PATH = "/change-password";

/** Moves keyboard focus to the main region after each navigation, so screen readers follow. */
function useFocusMainOnNavigate() {
  const { pathname } = useLocation();
  const mainRef = useRef<HTMLElement>(null);
  const firstRender = useRef(true);
  useEffect(() => {
    if (firstRender.current) {
      firstRender.current = false;
      return;
    }
    mainRef.current?.focus();
  }, [pathname]);
  return mainRef;
}

/** The signed-in frame: guards the session, then shows the top bar, navigation and screen. */
export function AppShell() {
  const location = useLocation();
  const mainRef = useFocusMainOnNavigate();
  const { user, isPending, error, refetch } = useSession();
  const signingOut = useIsMutating({ mutationKey: sessionKeys.signOut() }) > 0;

  if (isPending) {
    return (
      <p role="status" className="px-5 py-16 text-center text-ink-600">
        Loading Isobatch…
      </p>
    );
  }
  if (error) {
    return (
      <CalmError
        title="Isobatch cannot reach the server"
        actions={<Button onClick={() => void refetch()}>Try again</Button>}
      >
        <p>Your session could not be checked. Check the network connection, then try again.</p>
      </CalmError>
    );
  }
  if (!user) {
    // After an expiry the next sign-in returns here; after a deliberate sign-out it does not.
    const state = signingOut ? undefined : { from: location.pathname };
    return <Navigate to="/sign-in" replace state={state} />;
  }
  const mustChange = user.mustChangePassword;
  if (mustChange && location.pathname !== CHANGE_PASSWORD_PATH) {
    return <Navigate to={CHANGE_PASSWORD_PATH} replace />;
  }

  return (
    <div className="flex min-h-screen flex-col">
      <a
        href="#main"
        className="sr-only z-50 bg-white px-4 py-3 font-semibold focus:not-sr-only focus:absolute focus:top-2 focus:left-2"
      >
        Skip to main content
      </a>
      <TopBar user={user} showAccountLinks={!mustChange} />
      <div className="mx-auto flex w-full max-w-7xl flex-1 flex-col gap-6 px-5 py-6 xl:flex-row">
        {!mustChange && (
          <div className="border-b-2 border-ink-200 pb-3 xl:w-56 xl:shrink-0 xl:border-b-0 xl:pb-0">
            <SideNav roles={user.roles} />
          </div>
        )}
        <main id="main" ref={mainRef} tabIndex={-1} className="min-w-0 flex-1 focus:outline-none">
          <Outlet />
        </main>
      </div>
    </div>
  );
}
