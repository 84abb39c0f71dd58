import * as v from "valibot";
import { data, Form, redirect, useActionData, useLoaderData } from "react-router";
import type { Route } from "./+types/libraries.$id.uploads.$uploadId";
import { requireMember } from "~/lib/auth/guards.server";
import { prepareImport, UploadRejected } from "~/lib/libraries";
import { BACKGROUND_IMPORT_POINTS, runImport, startImport } from "~/lib/libraries/import-run.server";
import { getUploadMeta } from "~/lib/libraries/uploads.server";
import { AnalysisFailed, summariseUpload } from "~/lib/libraries/upload-analysis.server";
import type { UploadSummary } from "~/lib/libraries/upload-analysis";
import { blockLabel, ENCODING_LABEL, ENCODINGS, FIELDS, gallonAssumedNote, headerPowerKind, headerUnitRefusal, NUMERIC_FIELDS, powerKindNote, UNITS_BY_FIELD, type NumericField } from "~/lib/import";
import { saveCorrectedUpload } from "~/lib/libraries/upload-fix.server";
import { baseMappingOf, editsFromForm, encodingFromForm, impellerUnitOf, mappingFromForm, unitToChoose } from "~/lib/libraries/mapping-form";
import { viewerOf } from "~/lib/auth/viewer.server";
import { FixGrid } from "~/components/FixGrid";
import { MinFlowEditor } from "~/components/MinFlowEditor";
import { readMinFlowForm } from "~/lib/libraries/min-flow-form";
import { QueryId, readId, readFormSafe, readQuery } from "~/lib/shared/forms.server";
import { FormError, Notice, Options } from "~/components/forms";
import { CurvePreview } from "~/components/CurvePreview";
import { fmtBytes } from "~/components/library-bits";
import { TRACE_CAUTION } from "~/lib/tracer/sniff";
import { routeErrorBoundary } from "~/components/RouteError";
import { ListTable } from "~/components/ListTable";
import { PageHead } from "~/components/PageHead";
import { renderDeep, type UnitChoice } from "~/lib/shared/units";

export const meta: Route.MetaFunction = () => [{ title: "Map and check an upload · Dutymark" }];

/** The page of the maker's minimum flow list asked in the query (`?minflows=2`: curves 51–100; the first when none; past the last, the last). */
const minFlowPage = (request: Request) => readQuery(request.url, v.object({ minflows: QueryId })).minflows;

/** The analysis runs in a worker thread and is kept per upload (app/lib/libraries/upload-analysis.server.ts). */
const analysis = (c: { upload: { id: number; sha256: string }; lib: { mappingJson: string | null }; m: { user: { units: UnitChoice } }; minFlowPage: number | null }, mapping?: unknown) =>
  summariseUpload(c.upload, "stored", c.lib.mappingJson, mapping, c.minFlowPage)
    .then((s) => renderDeep(s, c.m.user.units)) // curve names carry the impeller as a quantity token
    .catch((e) => {
      if (e instanceof AnalysisFailed) throw data(`This file cannot be analysed with that mapping: ${e.message}`, { status: 422 });
      throw e;
    });

async function context(request: Request, params: { id: string; uploadId: string }) {
  const m = await requireMember(request, "library.write");
  const viewer = viewerOf(m);
  const libraryId = readId(params.id);
  const uploadId = readId(params.uploadId);
  const up = await getUploadMeta(viewer, libraryId, uploadId);
  return { m, viewer, libraryId, uploadId, minFlowPage: minFlowPage(request), ...up };
}

export async function loader({ request, params }: Route.LoaderArgs) {
  const c = await context(request, params);
  return {
    lib: { id: c.lib.id, name: c.lib.name },
    upload: { id: c.upload.id, filename: c.upload.filename, size: c.upload.sizeBytes, sha256: c.upload.sha256, source: c.upload.source },
    unitSystem: c.m.user.units,
    correctedFrom: readQuery(request.url, v.object({ from: QueryId })).from,
    ...(await analysis(c)),
  };
}

/** A fix or min-flow save that would change nothing: refused (422, as the fix the file cannot take; was 200), the page kept. */
const nothingSaved = (what: "cell" | "figure") => data({ error: `No ${what} was changed; nothing was saved.` }, { status: 422 });

export async function action({ request, params }: Route.ActionArgs) {
  const c = await context(request, params);
  const form = await readFormSafe(request);
  if (form.get("intent") === "fix") {
    try {
      const id = await saveCorrectedUpload(c.viewer, c.libraryId, c.uploadId, editsFromForm(form), encodingFromForm(form));
      if (id === null) return nothingSaved("cell");
      throw redirect(`/libraries/${c.libraryId}/uploads/${id}?from=${c.uploadId}`);
    } catch (e) {
      if (e instanceof UploadRejected) return data({ error: e.message }, { status: 422 });
      throw e;
    }
  }
  if (form.get("intent") === "min-flow") return saveMinFlows(c, form);
  const { mapping, error } = mappingFromForm(form);
  if (!mapping) return data({ error }, { status: 400 }); // the form's mapping fields are missing or malformed
  if (form.get("intent") === "import") {
    try {
      const { lib, uploadId, plan } = await prepareImport(c.viewer, c.libraryId, c.uploadId, mapping);
      const args = { libraryId: lib.id, uploadId, userId: c.viewer.userId || null, plan, note: String(form.get("note") ?? "") };
      // A big import runs on in the background: the library page shows its progress (and finds it again later).
      if (plan.points >= BACKGROUND_IMPORT_POINTS) throw redirect(`/libraries/${c.libraryId}?import=${await startImport(args)}#imports`);
      const r = await runImport(args);
      throw redirect(`/libraries/${c.libraryId}?imported=${r.number}`);
    } catch (e) {
      if (e instanceof UploadRejected) return data({ error: e.message, ...(await analysis(c, mapping)) }, { status: 422 });
      throw e;
    }
  }
  return analysis(c, mapping);
}

/**
 * The maker's minimum flow editor's figures (MinFlowEditor): read against the curves as analysed with the mapping the page
 * was served with (`base`), written into a corrected copy of the upload, which the page then checks again.
 */
async function saveMinFlows(c: Awaited<ReturnType<typeof context>>, form: FormData) {
  const base = baseMappingOf(form);
  if (!base.mapping) return data({ error: base.error }, { status: 400 });
  const s = await analysis(c, base.mapping);
  const r = readMinFlowForm(form, s.minFlows, c.m.user.units, { headerLine: s.sniff.headerLine, width: s.headers.length, decimalComma: s.sniff.decimalComma });
  if (!r.ok && r.status === 404) throw data(r.error, { status: 404 });
  if (!r.ok) return data({ error: r.error }, { status: r.status });
  if (r.changed === 0) return nothingSaved("figure");
  try {
    const id = await saveCorrectedUpload(c.viewer, c.libraryId, c.uploadId, r.edits, encodingFromForm(form), r.extraColumns);
    if (id === null) return nothingSaved("figure");
    throw redirect(`/libraries/${c.libraryId}/uploads/${id}?from=${c.uploadId}${s.minFlows.page > 1 ? `&minflows=${s.minFlows.page}` : ""}`);
  } catch (e) {
    if (e instanceof UploadRejected) return data({ error: e.message }, { status: 422 });
    throw e;
  }
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
  minflow: "Maker's minimum flow",
  type: "Pump type",
  size: "Nominal size",
  notes: "Notes",
  ignore: "— ignore —",
};

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? "" : "s"}`;

export default function UploadPreview() {
  const l = useLoaderData<typeof loader>();
  const a = useActionData<typeof action>() as (Partial<UploadSummary> & { error?: string }) | undefined;
  const d = { ...l, ...(a && "mapping" in a && a.mapping ? a : {}) } as typeof l;
  const bad = d.stats.curveSets - d.stats.curveSetsOk;
  return (
    <div className="space-y-6">
      <PageHead trail={[["/libraries", "Pump libraries"], [`/libraries/${l.lib.id}`, l.lib.name]]} title={`Map and check: ${l.upload.filename}`}>
        <p className="text-xs text-slate-500">
          {fmtBytes(l.upload.size)} · SHA-256 {l.upload.sha256.slice(0, 16)}… · delimiter “{d.sniff.delimiter}” · decimal{" "}
          {d.sniff.decimalComma ? "comma" : "point"} · header on line {d.sniff.headerLine}
          {d.sniff.hadBom ? " · byte-order mark removed" : ""}
        </p>
      </PageHead>
      <FormError error={a?.error} />
      {l.correctedFrom ? (
        <Notice>
          This is the corrected copy of upload {l.correctedFrom} (kept beside the original, which is unchanged). Checked again on the server below.
        </Notice>
      ) : null}
      {l.upload.source ? (
        <Notice>
          <span data-testid="traced-source">
            These points were {l.upload.source}. {TRACE_CAUTION} The revision will record this source.
          </span>
        </Notice>
      ) : null}
      {d.mappingSource === "saved" ? <Notice>Using the column mapping saved with this library from its last import.</Notice> : null}
      {d.savedMappingUnreadable ? (
        <Notice>
          <span data-testid="saved-mapping-unreadable">{d.savedMappingUnreadable.text}</span>
          {d.savedMappingUnreadable.lines.map((line, i) => (
            <span key={i} className="mt-1 block text-xs">
              {line}
            </span>
          ))}
        </Notice>
      ) : null}
      {d.title.lines.length && (d.title.model || d.title.speed || d.title.impeller || d.title.fluid) ? (
        <Notice>
          <span data-testid="title-read">
            Read from the title line{d.title.lines.length > 1 ? "s" : ""}:{" "}
            {[
              d.title.model ? `model ${d.title.model}` : "",
              d.title.speed ? `speed ${d.title.speed} rpm` : "",
              d.title.impeller ? `impeller Ø${d.title.impeller} ${d.title.impellerUnit}` : "",
              d.title.fluid ? `fluid ${d.title.fluid}` : "",
            ]
              .filter(Boolean)
              .join(" · ")}
            . Where no column holds them they are filled in below as the values for the whole file: check them before you import.
          </span>
        </Notice>
      ) : null}

      <Form method="post" className="space-y-6">
        <input type="hidden" name="base" value={JSON.stringify(d.mapping)} />
        <section className="panel overflow-x-auto">
          <h2 className="text-lg font-semibold">1 · Columns and units</h2>
          <div className="mt-2 flex flex-wrap gap-4 text-sm">
            <label className="flex items-center gap-2">
              Text encoding
              <select name="encoding" defaultValue={d.mapping.encoding ?? d.encoding.name} className="field w-auto" data-testid="encoding">
                <Options
                  values={ENCODINGS}
                  label={(e) => `${ENCODING_LABEL[e]}${e === d.encoding.name && d.encoding.how !== "chosen" ? (d.encoding.how === "fallback" ? " (not valid UTF-8: guessed)" : " (detected)") : ""}`}
                />
              </select>
            </label>
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
              Impeller Ø when the file has none ({impellerUnitOf(l.unitSystem.diameter)})
              <input type="hidden" name="defaultImpellerUnit" value={impellerUnitOf(l.unitSystem.diameter)} />
              <input
                name="defaultImpeller"
                inputMode="decimal"
                defaultValue={d.mapping.defaults.impeller !== undefined && d.mapping.defaults.impellerUnit === impellerUnitOf(l.unitSystem.diameter) ? d.mapping.defaults.impeller : ""}
                className="field w-24"
              />
            </label>
            <label className="flex items-center gap-2">
              Fluid (as stated)
              <input name="fluid" defaultValue={d.mapping.defaults.fluid ?? ""} className="field w-40" maxLength={120} />
            </label>
            <label className="flex items-center gap-2">
              <input type="checkbox" name="fillDownModel" defaultChecked={d.mapping.fillDownModel} /> copy the model down into blank cells
            </label>
            <label className="flex items-center gap-2">
              <input type="checkbox" name="fillDownKeys" defaultChecked={d.mapping.fillDownKeys ?? false} /> fill blank key cells (speed, impeller) from the row above
            </label>
            <label className="flex items-center gap-2">
              Curves with bad points
              <select name="policy" defaultValue={d.mapping.policy ?? "skip-curves"} className="field w-auto" data-testid="policy">
                <option value="skip-curves">skip the whole curve</option>
                <option value="drop-points">drop the bad points, keep curves with ≥ 3 good ones</option>
              </select>
            </label>
          </div>
          <ListTable head={["Column in the file", "First values", "Means", "Unit", "Curve block"]} className="mt-3">
            {d.mapping.columns.map((c) => {
              const numeric = (NUMERIC_FIELDS as readonly string[]).includes(c.field);
              // A header naming a unit the field does not take (kPa for head, Hz for speed): no unit is offered, the user picks one.
              const ask = numeric && unitToChoose(c) ? headerUnitRefusal(c.header, c.field) : null;
              // A header naming a power that is not shaft power (P1, hydraulic, per-unit) or one with two readings (P_w, Förderleistung).
              const notShaft = c.field === "ignore" || c.field === "power" ? headerPowerKind(c.header) : null;
              const notShaftNote = notShaft ? powerKindNote(notShaft, c.field) : null;
              // "gpm", "gal/min" naming neither gallon: the US gallon, assumed (unit-words.ts).
              const gallonNote = numeric ? gallonAssumedNote(c.header, c.unit, c.unitSource) : null;
              return (
                <tr key={c.index} className="border-t border-slate-100">
                  <td className="py-1 font-semibold">{c.header || `column ${c.index + 1}`}</td>
                  <td className="text-xs text-slate-600">{(d.samples[c.index] ?? []).join(" · ")}</td>
                  <td>
                    <select name={`field.${c.index}`} defaultValue={c.field} className="field w-auto py-0.5" aria-label={`Meaning of ${c.header}`}>
                      <Options values={FIELDS} label={(f) => FIELD_LABEL[f]} />
                    </select>
                    {notShaft && notShaftNote ? (
                      <span className="ml-1 text-xs text-duty-ink" data-testid={`${notShaft}-power`}>
                        {notShaftNote}
                      </span>
                    ) : null}
                  </td>
                  <td>
                    {numeric ? (
                      <select name={`unit.${c.index}`} defaultValue={ask ? "" : (c.unit ?? "")} className="field w-auto py-0.5" aria-label={`Unit of ${c.header}`}>
                        {ask ? <option value="">choose…</option> : null}
                        <Options values={UNITS_BY_FIELD[c.field as NumericField] as readonly string[]} />
                      </select>
                    ) : (
                      <span className="text-slate-400">—</span>
                    )}
                    {ask ? (
                      <span className="ml-1 text-xs text-fail" data-testid="unit-not-read">
                        “{ask.word}” is not a unit the importer reads for {FIELD_LABEL[c.field]}: choose the unit the values are in, or convert the column (see the problems below)
                      </span>
                    ) : c.unitSource === "default" ? (
                      <span className="ml-1 text-xs text-duty-ink">assumed</span>
                    ) : gallonNote ? (
                      <span className="ml-1 text-xs text-duty-ink" data-testid="gallon-assumed">{gallonNote}</span>
                    ) : null}
                  </td>
                  <td className="text-xs">{c.block ? blockLabel(c.block) : ""}</td>
                </tr>
              );
            })}
          </ListTable>
          <p className="mt-3">
            <button className="btn-quiet" name="intent" value="check">
              Check again with these columns
            </button>
          </p>
        </section>

        <section className="panel">
          <h2 className="text-lg font-semibold">2 · What the importer found</h2>
          <p className="mt-1 text-sm" data-testid="import-stats">
            {plural(d.stats.curveSets, "curve")} ({d.stats.curveSetsOk} good, {bad} flagged) from {plural(d.stats.pointRows, "point row")} ·{" "}
            {plural(d.stats.errors, "error")} · {plural(d.stats.warnings, "warning")}
          </p>
          {d.preview.length ? (
            <div className="mt-3">
              <CurvePreview unitSystem={l.unitSystem} title={`Preview of ${l.upload.filename}`} curves={d.preview} />
              {d.stats.curveSets > d.preview.length ? (
                <p className="text-xs text-slate-500">Chart shows the first {d.preview.length} of {d.stats.curveSets} curves.</p>
              ) : null}
            </div>
          ) : null}
          {d.problemCount ? (
            <div className="mt-4 max-h-96 overflow-y-auto">
              <ListTable head={["Line", "Column", "Problem", "Curve"]} className="" label="Problems found" sticky>
                {d.problems.map((p, i) => (
                  <tr key={i} className="border-t border-slate-100">
                    <td className="py-0.5">{p.row}</td>
                    <td>{p.column ?? "—"}</td>
                    <td className={p.severity === "error" ? "text-fail" : "text-duty-ink"}>
                      {p.severity === "error" ? "✖ " : "▲ "}
                      {p.reason}
                    </td>
                    <td className="text-xs">{p.curve}</td>
                  </tr>
                ))}
              </ListTable>
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
              ? `Imports the ${plural(d.stats.curveSetsOk, "good curve")} as a new revision${bad ? ` and skips the ${bad} flagged` : ""}. Selections made from older revisions keep theirs.${d.flagged.total ? " To fix flagged rows, correct them in the grid below." : ""}`
              : `No curve passed the checks. Change the column mapping above${d.flagged.total ? ", correct the flagged rows in the grid below," : ""} or fix the file and upload it again.`}
          </p>
          <label className="block max-w-xl text-sm">
            <span className="label">Note for this revision</span>
            <input name="note" className="field" maxLength={500} placeholder="e.g. vendor export of March, new 4-pole range" />
          </label>
          <button className="btn" name="intent" value="import" disabled={d.stats.curveSetsOk === 0}>
            Import {plural(d.stats.curveSetsOk, "curve")}
          </button>
        </section>
      </Form>
      <FixGrid headers={d.headers} rows={d.flagged.rows} total={d.flagged.total} encoding={d.mapping.encoding ?? d.encoding.name} />
      <MinFlowEditor list={d.minFlows} units={l.unitSystem} mapping={JSON.stringify(d.mapping)} encoding={d.mapping.encoding ?? d.encoding.name} />
    </div>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "this upload and its column mapping", back: { href: "/libraries", label: "All pump libraries" } });
