// A plain list of records as a table: the column heads (an empty string for an actions column) and
// the rows the caller renders. One look for the account, workspace and selection lists.
import type { ReactNode } from "react";

export function ListTable({ head, children, className = "mt-2" }: { head: string[]; children: ReactNode; className?: string }) {
  return (
    <table className={`${className} w-full text-sm`.trim()}>
      <thead className="text-left text-slate-600">
        <tr>
          {head.map((h, i) => (h ? <th key={i} className={i === 0 ? "py-1" : undefined}>{h}</th> : <th key={i} />))}
        </tr>
      </thead>
      <tbody>{children}</tbody>
    </table>
  );
}
