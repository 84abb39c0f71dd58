// A reference table of the /api page: column heads (none for a plain list) and rows of cells; `cells`
// gives each column's extra classes (font-mono, text-xs), `top` aligns multi-line rows at the top.
import type { ReactNode } from "react";

export function DocTable({ head, rows, cells = [], top = true }: { head?: string[]; rows: ReactNode[][]; cells?: string[]; top?: boolean }) {
  const pad = (i: number, n: number) => (i < n - 1 ? "py-1 pr-4" : "py-1");
  return (
    <table className="w-full text-left text-sm">
      {head ? (
        <thead>
          <tr className="border-b border-slate-200">
            {head.map((h, i) => (
              <th key={h} className={pad(i, head.length)}>{h}</th>
            ))}
          </tr>
        </thead>
      ) : null}
      <tbody>
        {rows.map((row, r) => (
          <tr key={r} className={top ? "border-b border-slate-100 align-top" : "border-b border-slate-100"}>
            {row.map((cell, i) => (
              <td key={i} className={`${pad(i, row.length)} ${cells[i] ?? ""}`.trim()}>{cell}</td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}
