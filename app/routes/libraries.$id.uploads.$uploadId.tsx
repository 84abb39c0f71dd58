import * as v from "valibot";
import { data, Form, redirect, useActionData, useLoaderData } from "react-router";
import type { Route } from "./+types/libraries.$id.uploads.$uploadId";
import { requireMember } from "~/lib/guards.server";
import { importUpload, UploadRejected } from "~/lib/libraries.server";
import { getUploadMeta, uploadBytes } from "~/lib/uploads.server";
import { AnalysisFailed, summariseUpload } from "~/lib/upload-analysis.server";
import type { UploadSummary } from "~/lib/upload-analysis";
import { blockLabel, FIELDS, MappingSchema, NUMERIC_FIELDS, UNITS_BY_FIELD, type Mapping, type NumericField } from "~/lib/import";
import { readId, readFormSafe } from "~/lib/forms.server";
import { FormError, Notice } from "~/components/forms";
import { CurvePreview } from "~/components/CurvePreview";
import { fmtBytes } from "~/components/library-bits";

export const meta: Route.MetaFunction = () => [{ title: "Map and check an upload · Dutymark" }];

/** The analysis runs in a worker thread and is kept per upload (app/lib/upload-analysis.server.ts). */
const analysis = (c: { upload: { id: number; sha256: string }; lib: { mappingJson: string | null } }, mapping?: unknown) =>
  summariseUpload(c.upload, () => uploadBytes(c.upload.id), c.lib.mappingJson, mapping).catch((e) => {
    if (e instanceof AnalysisFailed) throw data(`This file cannot be analysed with that mapping: ${e.message}`, { status: 422 });
    throw e;
  });

async function context(request: Request, params: { id: string; uploadId: string }) {
  const m = await requireMember(request, "library.write");
  const viewer = { userId: m.user.id, workspace: m.workspace, role: m.role };
  const libraryId = readId(params.id);
  const uploadId = readId(params.uploadId);
  const up = await getUploadMeta(viewer, libraryId, uploadId);
  return { m, viewer, libraryId, uploadId, ...up };
}

export async function loader({ request, params }: Route.LoaderArgs) {
  const c = await context(request, params);
  return {
    lib: { id: c.lib.id, name: c.lib.name },
    upload: { id: c.upload.id, filename: c.upload.filename, size: c.upload.sizeBytes, sha256: c.upload.sha256 },
    unitSystem: c.m.user.unitSystem,
    ...(await analysis(c)),
  };
}

/** Rebuilds a mapping from the form: the base mapping (JSON) with the user's field/unit choices. */
function mappingFromForm(form: FormData): { mapping?: Mapping; error?: string } {
  let base: unknown;
  try {
    base = JSON.parse(String(form.get("base") ?? ""));
  } catch {
    return { error: "The mapping could not be read; reload the page." };
  }
  const parsed = v.safeParse(MappingSchema, base);
  if (!parsed.success) return { error: "The mapping could not be read; reload the page." };
  const m: Mapping = structuredClone(parsed.output);
  const layout = form.get("layout");
  if (layout === "long" || layout === "wide") m.layout = layout;
  m.columns = m.columns.map((c) => {
    const field = String(form.get(`field.${c.index}`) ?? c.field) as Mapping["columns"][number]["field"];
    const unitRaw = String(form.get(`unit.${c.index}`) ?? "");
    const numeric = (NUMERIC_FIELDS as readonly string[]).includes(field);
    const allowed = numeric ? (UNITS_BY_FIELD[field as NumericField] as readonly string[]) : [];
    const unit = numeric ? ((allowed.includes(unitRaw) ? unitRaw : allowed[0]) as Mapping["columns"][number]["unit"]) : null;
    const changed = field !== c.field || unit !== c.unit;
    return { ...c, field, unit, unitSource: changed ? "user" : c.unitSource, block: m.layout === "wide" ? c.block : null };
  });
  const model = String(form.get("defaultModel") ?? "").trim();
  const speed = Number(form.get("defaultSpeed") ?? "");
  m.defaults = { ...m.defaults, model: model || undefined, speed: Number.isFinite(speed) && speed > 0 ? speed : undefined };
  m.fillDownModel = form.get("fillDownModel") === "on";
  const check = v.safeParse(MappingSchema, m);
  if (!check.success) return { error: `This mapping cannot work: ${check.issues.map((i) => i.message).join("; ")}.` };
  return { mapping: check.output };
}

export async function action({ request, params }: Route.ActionArgs) {
  const c = await context(request, params);
  const form = await readFormSafe(request);
  const { mapping, error } = mappingFromForm(form);
  if (!mapping) return { error };
  if (form.get("intent") === "import") {
    try {
      const r = await importUpload(c.viewer, c.libraryId, c.uploadId, mapping, String(form.get("note") ?? ""));
      throw redirect(`/libraries/${c.libraryId}?imported=${r.number}`);
    } catch (e) {
      if (e instanceof UploadRejected) return { error: e.message, ...(await analysis(c, mapping)) };
      throw e;
    }
  }
  return analysis(c, mapping);
}

const FIELD_LABEL: Record<string, string> = {
  model: "Model",
  speed: "Speed",
  impeller: "Impeller Ø",
  flow: "Flow",
  head: "Head",
  efficiency: "Efficiency",
  power: "Shaft power",
  npshr: "NPSHr",
  type: "Pump type",
  size: "Nominal size",
  notes: "Notes",
  ignore: "— ignore —",
};

export default function UploadPreview() {
  const l = useLoaderData<typeof loader>();
  const a = useActionData<typeof action>() as (Partial<UploadSummary> & { error?: string }) | undefined;
  const d = { ...l, ...(a && "mapping" in a && a.mapping ? a : {}) } as typeof l;
  const bad = d.stats.curveSets - d.stats.curveSetsOk;
  return (
    <div className="space-y-6">
      <div>
        <p className="text-sm">
          <a href="/libraries">Pump libraries</a> › <a href={`/libraries/${l.lib.id}`}>{l.lib.name}</a> ›
        </p>
        <h1 className="text-2xl font-bold text-brand-900">Map and check: {l.upload.filename}</h1>
        <p className="text-xs text-slate-500">
          {fmtBytes(l.upload.size)} · SHA-256 {l.upload.sha256.slice(0, 16)}… · delimiter “{d.sniff.delimiter}” · decimal{" "}
          {d.sniff.decimalComma ? "comma" : "point"} · header on line {d.sniff.headerLine}
          {d.sniff.hadBom ? " · UTF-8 BOM removed" : ""}
        </p>
      </div>
      <FormError error={a?.error} />
      {d.mappingSource === "saved" ? <Notice>Using the column mapping saved with this library from its last import.</Notice> : null}

      <Form method="post" className="space-y-6">
        <input type="hidden" name="base" value={JSON.stringify(d.mapping)} />
        <section className="panel overflow-x-auto">
          <h2 className="text-lg font-semibold">1 · Columns and units</h2>
          <div className="mt-2 flex flex-wrap gap-4 text-sm">
            <label className="flex items-center gap-2">
              Layout
              <select name="layout" defaultValue={d.mapping.layout} className="field w-auto">
                <option value="long">one row per point</option>
                <option value="wide">column blocks per impeller or speed</option>
              </select>
            </label>
            <label className="flex items-center gap-2">
              Model when the file has none
              <input name="defaultModel" defaultValue={d.mapping.defaults.model ?? ""} className="field w-40" />
            </label>
            <label className="flex items-center gap-2">
              Speed when the file has none (rpm)
              <input name="defaultSpeed" inputMode="decimal" defaultValue={d.mapping.defaults.speed ?? ""} className="field w-24" />
            </label>
            <label className="flex items-center gap-2">
              <input type="checkbox" name="fillDownModel" defaultChecked={d.mapping.fillDownModel} /> copy the model down into blank cells
            </label>
          </div>
          <table className="mt-3 w-full text-sm">
            <thead className="text-left text-slate-600">
              <tr>
                <th className="py-1">Column in the file</th>
                <th>First values</th>
                <th>Means</th>
                <th>Unit</th>
                <th>Curve block</th>
              </tr>
            </thead>
            <tbody>
              {d.mapping.columns.map((c) => {
                const numeric = (NUMERIC_FIELDS as readonly string[]).includes(c.field);
                return (
                  <tr key={c.index} className="border-t border-slate-100">
                    <td className="py-1 font-semibold">{c.header || `column ${c.index + 1}`}</td>
                    <td className="text-xs text-slate-600">{(d.samples[c.index] ?? []).join(" · ")}</td>
                    <td>
                      <select name={`field.${c.index}`} defaultValue={c.field} className="field w-auto py-0.5" aria-label={`Meaning of ${c.header}`}>
                        {FIELDS.map((f) => (
                          <option key={f} value={f}>
                            {FIELD_LABEL[f]}
                          </option>
                        ))}
                      </select>
                    </td>
                    <td>
                      {numeric ? (
                        <select name={`unit.${c.index}`} defaultValue={c.unit ?? ""} className="field w-auto py-0.5" aria-label={`Unit of ${c.header}`}>
                          {(UNITS_BY_FIELD[c.field as NumericField] as readonly string[]).map((u) => (
                            <option key={u} value={u}>
                              {u}
                            </option>
                          ))}
                        </select>
                      ) : (
                        <span className="text-slate-400">—</span>
                      )}
                      {c.unitSource === "default" ? <span className="ml-1 text-xs text-duty-ink">assumed</span> : null}
                    </td>
                    <td className="text-xs">{c.block ? blockLabel(c.block) : ""}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
          <p className="mt-3">
            <button className="btn-quiet" name="intent" value="check">
              Check again with these columns
            </button>
          </p>
        </section>

        <section className="panel">
          <h2 className="text-lg font-semibold">2 · What the importer found</h2>
          <p className="mt-1 text-sm" data-testid="import-stats">
            {d.stats.curveSets} curves ({d.stats.curveSetsOk} good, {bad} flagged) from {d.stats.pointRows} point rows ·{" "}
            {d.stats.errors} errors · {d.stats.warnings} warnings
          </p>
          {d.preview.length ? (
            <div className="mt-3">
              <CurvePreview unitSystem={l.unitSystem} title={`Preview of ${l.upload.filename}`} curves={d.preview} />
              {d.curveSets.length > d.preview.length ? (
                <p className="text-xs text-slate-500">Chart shows the first {d.preview.length} of {d.curveSets.length} curves.</p>
              ) : null}
            </div>
          ) : null}
          {d.problemCount ? (
            <div className="mt-4 max-h-96 overflow-y-auto">
              <table className="w-full text-sm" aria-label="Problems found">
                <thead className="sticky top-0 bg-white text-left text-slate-600">
                  <tr>
                    <th className="py-1">Line</th>
                    <th>Column</th>
                    <th>Problem</th>
                    <th>Curve</th>
                  </tr>
                </thead>
                <tbody>
                  {d.problems.map((p, i) => (
                    <tr key={i} className="border-t border-slate-100">
                      <td className="py-0.5">{p.row}</td>
                      <td>{p.column ?? "—"}</td>
                      <td className={p.severity === "error" ? "text-fail" : "text-duty-ink"}>
                        {p.severity === "error" ? "✖ " : "▲ "}
                        {p.reason}
                      </td>
                      <td className="text-xs">{p.curveKey ?? ""}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
              {d.problemCount > d.problems.length ? (
                <p className="text-xs text-slate-500">
                  Showing {d.problems.length} of {d.problemCount} problems.
                </p>
              ) : null}
            </div>
          ) : (
            <p className="mt-2 text-sm text-brand-700">No problems found.</p>
          )}
        </section>

        <section className="panel space-y-3">
          <h2 className="text-lg font-semibold">3 · Import</h2>
          <p className="text-sm text-slate-700">
            {d.stats.curveSetsOk > 0
              ? `Imports the ${d.stats.curveSetsOk} good curves as a new revision${bad ? ` and skips the ${bad} flagged ones` : ""}. Selections made from older revisions keep theirs. To fix flagged curves, correct the file and upload it again.`
              : "No curve passed the checks. Change the column mapping above or fix the file and upload it again."}
          </p>
          <label className="block max-w-xl text-sm">
            <span className="label">Note for this revision</span>
            <input name="note" className="field" maxLength={500} placeholder="e.g. vendor export of March, new 4-pole range" />
          </label>
          <button className="btn" name="intent" value="import" disabled={d.stats.curveSetsOk === 0}>
            Import {d.stats.curveSetsOk} curves
          </button>
        </section>
      </Form>
    </div>
  );
}
