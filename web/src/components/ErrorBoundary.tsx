import { Component, type ErrorInfo, type ReactNode } from "react";
import { isRouteErrorResponse, Link, useRouteError } from "react-router";
import { Button } from "./Button";
import { CalmError } from "./CalmError";

interface BoundaryState {
  failed: boolean;
}

/** Last line of defence around the whole app: if rendering crashes, offer a clean reload. */
export class ErrorBoundary extends Component<{ children: ReactNode }, BoundaryState> {
  state: BoundaryState = { failed: false };

  static getDerivedStateFromError(): BoundaryState {
    return { failed: true };
  }

  componentDidCatch(error: Error, info: ErrorInfo): void {
    console.error("Isobatch stopped rendering", error, info.componentStack);
  }

  render() {
    if (!this.state.failed) return this.props.children;
    return (
      <CalmError
        title="Isobatch needs to reload"
        actions={
          <Button onClick={() => window.location.assign("/")}>Reload Isobatch</Button>
        }
      >
        <p>Something unexpected stopped this page from showing.</p>
        <p>Entries you saved before this are kept by the server. Reload to carry on.</p>
      </CalmError>
    );
  }
}

/** The router's errorElement: a calm message for a screen that failed, with a way back. */
export function RouteError() {
  const error = useRouteError();
  if (isRouteErrorResponse(error) && error.status === 404) {
    return (
      <CalmError title="Page not found" actions={<Link to="/">Go to your home</Link>}>
        <p>There is no page at this address.</p>
      </CalmError>
    );
  }
  console.error("A screen failed", error);
  return (
    <CalmError
      title="This screen could not be shown"
      actions={
        <>
          <Button onClick={() => window.location.reload()}>Try again</Button>
          <Link to="/" className="inline-flex min-h-11 items-center px-2">
            Go to your home
          </Link>
        </>
      }
    >
      <p>Something unexpected happened while opening this screen.</p>
      <p>Try again. If it keeps happening, tell your administrator what you were doing.</p>
    </CalmError>
  );
}
