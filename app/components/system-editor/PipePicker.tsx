// Pipe table and nominal size of one run: tables grouped by standard, a search box that narrows
// tables and sizes (by standard, name or size label such as "DN100" or "d110"), and the inner
// diameter of the chosen size shown at once. Without JavaScript the two selects still post. A table or size the catalogue
// does not list now (old data) is offered as stored, with the system warning's words.
import { useMemo, useState } from "react";
import { PIPE_TABLES, type PipeTable } from "~/engine";
import { fmtQ, type UnitChoice } from "~/lib/shared/units";

/** Tables grouped by standard, in catalogue order. */
export function groupByStandard(tables: readonly PipeTable[]): { standard: string; tables: PipeTable[] }[] {
  const groups: { standard: string; tables: PipeTable[] }[] = [];
  for (const t of tables) {
    const g = groups.find((x) => x.standard === t.standard);
    if (g) g.tables.push(t);
    else groups.push({ standard: t.standard, tables: [t] });
  }
  return groups;
}

/** Tables matching a search: every word must appear in the standard, name, id or one size label. */
export function searchPipeTables(query: string, tables: readonly PipeTable[] = PIPE_TABLES): PipeTable[] {
  const words = query.toLowerCase().split(/\s+/).filter(Boolean);
  if (words.length === 0) return [...tables];
  const norm = (s: string) => s.toLowerCase().replace(/\s+/g, "");
  return tables.filter((t) => {
    const hay = `${t.standard} ${t.name} ${t.id}`.toLowerCase();
    return words.every((w) => hay.includes(w) || t.sizes.some((s) => norm(s.nominal) === norm(w)));
  });
}

/**
 * A run's table and size as stored where the catalogue does not list them now (system-form.ts `systemFormValues`). Nothing
 * of it is posted: the server keeps such a size only on the run its stored document holds it on (`readSystemForm`).
 */
export type StoredSize = { table: string; nominal: string; note: string };

/** What an option of a table or size the catalogue does not list now says after its name. */
export const NOT_LISTED = "(not in the catalogue now)";

export function PipePicker({ index, table, nominal, stored, unitSystem, error, onTableChange }: { index: number; table: string; nominal: string; stored?: StoredSize | null; unitSystem: UnitChoice; error?: string; onTableChange?: (tableId: string) => void }) {
  const [query, setQuery] = useState("");
  const [tableId, setTableId] = useState(table);
  const [size, setSize] = useState(nominal);
  const shown = useMemo(() => {
    const found = searchPipeTables(query);
    // The chosen table always stays in the list, so a search never changes what is posted.
    const chosen = PIPE_TABLES.find((t) => t.id === tableId);
    return chosen && !found.includes(chosen) ? [chosen, ...found] : found;
  }, [query, tableId]);
  const current = PIPE_TABLES.find((t) => t.id === tableId) ?? null;
  const sizeRow = current?.sizes.find((s) => s.nominal === size) ?? null;
  // Old data: the stored table (when the catalogue has it no more) and size stay offered as stored, so the form shows and
  // posts them unchanged, with the system warning's words (the stored bore is used) while they are chosen.
  const storedTableGone = !!stored && !PIPE_TABLES.some((t) => t.id === stored.table);
  const storedShown = !!stored && tableId === stored.table;
  const asStored = storedShown && size === stored.nominal;
  const d = (m: number) => fmtQ(unitSystem, "diameter", m);
  const p = `run.${index}.`;
  return (
    <>
      <div className="col-span-2">
        <label className="label" htmlFor={`f-${p}pipe-search`}>
          Find a pipe <span className="ml-1 font-normal normal-case text-slate-500">(standard, material or size, e.g. “EN 545”, “PE100”, “DN100”)</span>
        </label>
        <input id={`f-${p}pipe-search`} type="search" className="field" value={query} onChange={(e) => setQuery(e.target.value)} aria-controls={`f-${p}table`} />
        {query && shown.length === 0 ? <p className="text-xs text-slate-500">No table matches “{query}”.</p> : null}
      </div>
      <div>
        <label className="label" htmlFor={`f-${p}table`}>
          Pipe
        </label>
        <select
          id={`f-${p}table`}
          name={`${p}table`}
          value={tableId}
          onChange={(e) => {
            setTableId(e.target.value);
            onTableChange?.(e.target.value);
            const next = PIPE_TABLES.find((t) => t.id === e.target.value);
            if (!next?.sizes.some((s) => s.nominal === size)) setSize("");
          }}
          className="field"
        >
          <option value="">typed inner diameter</option>
          {storedTableGone ? (
            <option value={stored.table}>
              {stored.table} {NOT_LISTED}
            </option>
          ) : null}
          {groupByStandard(shown).map((g) => (
            <optgroup key={g.standard} label={g.standard}>
              {g.tables.map((t) => (
                <option key={t.id} value={t.id}>
                  {t.name}
                </option>
              ))}
            </optgroup>
          ))}
        </select>
      </div>
      <div>
        <label className="label" htmlFor={`f-${p}nominal`}>
          Nominal size
        </label>
        <select id={`f-${p}nominal`} name={`${p}nominal`} value={size} onChange={(e) => setSize(e.target.value)} className="field" aria-describedby={`f-${p}id-hint`}>
          <option value="">—</option>
          {storedShown ? (
            <option value={stored.nominal}>
              {stored.nominal} {NOT_LISTED}
            </option>
          ) : null}
          {(current?.sizes ?? []).map((s) => (
            <option key={s.nominal} value={s.nominal}>
              {s.nominal}
            </option>
          ))}
        </select>
        {error ? <p className="text-xs text-fail">{error}</p> : null}
      </div>
      <p id={`f-${p}id-hint`} className="col-span-2 text-xs text-slate-600" aria-live="polite">
        {asStored
          ? stored.note
          : current && sizeRow
          ? `Inner diameter from the table: ${d(sizeRow.innerDiameter)} (OD ${d(sizeRow.outsideDiameter)}, wall ${d(sizeRow.wall)}) — ${current.source}.`
          : current
            ? `Pick a size of ${current.name}; its inner diameter shows here.`
            : "No table: type the inner diameter below."}
      </p>
    </>
  );
}
