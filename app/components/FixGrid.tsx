import { Form } from "react-router";

import type { FlaggedRow } from "~/lib/libraries/upload-analysis";

export type { FlaggedRow };

/**
 * Flagged rows as an editable grid (a plain form: works without JavaScript). The server applies
 * the changed cells to the original file and keeps the result as a new upload, then checks it again.
 */
export function FixGrid({ headers, rows, total, encoding }: { headers: string[]; rows: FlaggedRow[]; total: number; encoding: string }) {
  if (rows.length === 0) return null;
  return (
    <section className="panel space-y-3" aria-labelledby="fix-grid-title">
      <h2 id="fix-grid-title" className="text-lg font-semibold">
        Fix flagged rows here
      </h2>
      <p className="text-sm text-slate-700">
        Correct the cells below and save: the corrected file is kept as a new upload beside the original (the original is not changed) and
        checked again. {total > rows.length ? `Showing the first ${rows.length} of ${total} flagged rows.` : ""}
      </p>
      <Form method="post" className="space-y-3">
        <input type="hidden" name="intent" value="fix" />
        <input type="hidden" name="encoding" value={encoding} />
        <div className="max-h-[28rem] overflow-auto">
          <table className="w-full text-sm" aria-label="Flagged rows">
            <thead className="sticky top-0 bg-white text-left text-slate-600">
              <tr>
                <th className="py-1 pr-2">Line</th>
                {headers.map((h, i) => (
                  <th key={i} className="pr-1 font-normal">
                    {h}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {rows.map((r) => {
                const bad = new Set(r.problems.map((p) => p.index));
                return (
                  <tr key={r.line} className="border-t border-slate-100 align-top">
                    <td className="py-1 pr-2">{r.line}</td>
                    {headers.map((h, i) => (
                      <td key={i} className="pr-1">
                        <input
                          name={`cell.${r.line}.${i}`}
                          defaultValue={r.cells[i] ?? ""}
                          aria-label={`Line ${r.line}, ${h}`}
                          aria-invalid={bad.has(i) || undefined}
                          maxLength={200}
                          className={`field w-24 px-1 py-0.5 ${bad.has(i) ? "border-fail bg-red-50" : ""}`}
                        />
                      </td>
                    ))}
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
        <ul className="text-xs text-fail">
          {rows.flatMap((r) => r.problems.map((p, k) => <li key={`${r.line}.${k}`}>line {r.line}: {p.reason}</li>))}
        </ul>
        <button className="btn" name="save" value="1">
          Save corrected copy and check again
        </button>
      </Form>
    </section>
  );
}
