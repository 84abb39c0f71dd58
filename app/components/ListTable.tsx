// A plain list of records as a table: the column heads (an empty string for an actions column) and
// the rows the caller renders; `sticky` keeps the heads in view in a scrolling box. One look for the account, workspace and selection lists.
import type { ReactNode } from "react";

export function ListTable({ head, children, className = "mt-2", label, sticky }: { head: string[]; children: ReactNode; className?: string; label?: string; sticky?: boolean }) {
  return (
    <table className={`${className} w-full text-sm`.trim()} aria-label={label}>
      <thead className={sticky ? "sticky top-0 bg-white text-left text-slate-600" : "text-left text-slate-600"}>
        <tr>
          {head.map((h, i) => (h ? <th key={i} className={i === 0 ? "py-1" : undefined}>{h}</th> : <th key={i} />))}
        </tr>
      </thead>
      <tbody>{children}</tbody>
    </table>
  );
}
