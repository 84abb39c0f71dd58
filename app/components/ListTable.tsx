// A plain list of records as a table: the column heads (an empty string for an actions column) and
// the rows the caller renders; `sticky` keeps the heads in view in a scrolling box, `small` sets the table in
// small type, `caption` titles it. One look for the account, workspace, project, library and selection lists.
// `NameCell` is a row's first cell: the record's name as a link to its page, with an optional line below.
import type { ReactNode } from "react";

export function ListTable({ head, children, className = "mt-2", label, sticky, small, caption }: {
  head: string[];
  children: ReactNode;
  className?: string;
  label?: string;
  sticky?: boolean;
  small?: boolean;
  caption?: ReactNode;
}) {
  return (
    <table className={`${className} w-full ${small ? "text-xs" : "text-sm"}`.trim()} aria-label={label}>
      {caption ? <caption className={small ? "text-left font-semibold" : "text-left text-xs text-slate-600"}>{caption}</caption> : null}
      <thead className={sticky ? "sticky top-0 bg-white text-left text-slate-600" : "text-left text-slate-600"}>
        <tr>
          {head.map((h, i) => (h ? <th key={i} className={i === 0 ? "py-1" : undefined}>{h}</th> : <th key={i} />))}
        </tr>
      </thead>
      <tbody>{children}</tbody>
    </table>
  );
}

export function NameCell({ href, name, children }: { href: string; name: string; children?: ReactNode }) {
  return (
    <td className="py-1">
      <a href={href} className="font-semibold">
        {name}
      </a>
      {children}
    </td>
  );
}
