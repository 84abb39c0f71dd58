// The trail above a page's title: each step a link, then "›" (the page itself is the title below).
import { Fragment } from "react";
import { Link } from "react-router";

export function Crumbs({ trail, className = "text-sm" }: { trail: readonly (readonly [to: string, label: string])[]; className?: string }) {
  return (
    <p className={className}>
      {trail.map(([to, label], i) => (
        <Fragment key={i}>
          <Link to={to}>{label}</Link> ›{" "}
        </Fragment>
      ))}
    </p>
  );
}
