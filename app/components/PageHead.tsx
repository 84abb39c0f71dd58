// A record page's head: the trail back up (Crumbs), the page's title with an optional `badge` beside it (the
// record's state), and below it `line` (the record's facts, empty ones left out, joined with " · ") or what the
// caller puts there.
import type { ReactNode } from "react";
import { Crumbs } from "./Crumbs";

export function PageHead({ trail, title, badge, line, children }: {
  trail: readonly (readonly [to: string, label: string])[];
  title: ReactNode;
  badge?: ReactNode;
  line?: readonly (string | null | undefined)[];
  children?: ReactNode;
}) {
  const facts = line?.filter(Boolean).join(" · ");
  return (
    <div>
      <Crumbs trail={trail} />
      <h1 className={`${badge ? "flex flex-wrap items-center gap-3 " : ""}text-2xl font-bold text-brand-900`}>
        {title}
        {badge}
      </h1>
      {facts ? <p className="text-sm text-slate-600">{facts}</p> : null}
      {children}
    </div>
  );
}
