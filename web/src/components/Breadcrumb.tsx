import { Fragment } from "react";
import { Link } from "react-router";

export interface Crumb {
  to?: string;
  label: string;
}

/** The trail of parent screens above a screen's heading; the last crumb is the current one. */
export function Breadcrumb({ crumbs }: { crumbs: Crumb[] }) {
  return (
    <nav aria-label="You are here">
      <p>
        {crumbs.map((crumb, index) => (
          <Fragment key={`${crumb.label}-${index}`}>
            {index > 0 && <span aria-hidden="true"> › </span>}
            {crumb.to ? <Link to={crumb.to}>{crumb.label}</Link> : <span aria-current="page">{crumb.label}</span>}
          </Fragment>
        ))}
      </p>
    </nav>
  );
}
