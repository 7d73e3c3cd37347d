import { Link } from "react-router";
import { CalmError } from "../components/CalmError";

/** The 404 screen for any address Isobatch does not have. */
export default function NotFound() {
  return (
    <CalmError
      title="Page not found"
      actions={
        <Link to="/" className="inline-flex min-h-11 items-center font-semibold">
          Go to your home
        </Link>
      }
    >
      <p>There is no page at this address. It may have been typed wrongly or moved.</p>
    </CalmError>
  );
}
