import * as v from "valibot";
import { Form, redirect, useLoaderData } from "react-router";
import type { Route } from "./+types/libraries.$id";
import { requireMember } from "~/lib/auth/guards.server";
import { deleteLibrary, getLibrary, listRevisions, modelCurves, MODEL_PAGE_ROWS, pendingUploads, revisionModelList, updateLibrary } from "~/lib/libraries";
import { viewerOf } from "~/lib/auth/viewer.server";
import { fmtFlow, fmtHead, fmtPct, fmtPower, fromChosen, labelOf, renderUnits } from "~/lib/shared/units";
import { can } from "~/lib/auth/permissions";
import { FreeText, invalid, Name, QueryId, QueryText, readForm, readId, readFormSafe, readQuery } from "~/lib/shared/forms.server";
import { VISIBILITIES } from "~/lib/shared/constants";
import { Field, FormOutcome, Notice } from "~/components/forms";
import { AccessBadge, curveLabel, fmtBytes } from "~/components/library-bits";
import { UploadDrop } from "~/components/UploadDrop";
import { ImportList } from "~/components/ImportList";
import { recentImports } from "~/lib/libraries/import-progress.server";
import { CurvePreview } from "~/components/CurvePreview";
import { routeErrorBoundary } from "~/components/RouteError";
import { ListTable } from "~/components/ListTable";
import { PageHead } from "~/components/PageHead";
import { useFormResult } from "~/components/useFormResult";
import { fmtUtc, fmtInt } from "~/lib/shared/format";
import { pageOf } from "~/lib/shared/paging";
import { positiveFilter } from "~/lib/shared/decimal";
import { Pager } from "~/components/Pager";

export const meta: Route.MetaFunction = ({ data }) => [{ title: `${data?.lib.name ?? "Library"} · Dutymark` }];

/** The page's query string: filters, the model shown, and what an import just did (odd values fall back). */
const LibraryQuery = v.object({
  q: QueryText(),
  type: QueryText(),
  size: QueryText(),
  speed: QueryText(40),
  flow: QueryText(40),
  head: QueryText(40),
  sort: QueryText(10),
  model: QueryId,
  page: QueryId, // 1.. (a page past the last shows the last)
  imported: QueryText(12),
  import: QueryId,
});

export async function loader({ request, params }: Route.LoaderArgs) {
  const m = await requireMember(request, "library.read");
  const viewer = viewerOf(m);
  const id = readId(params.id);
  const lib = await getLibrary(viewer, id);
  const locked = lib.access === "locked";
  const owner = lib.access === "owner";
  const writer = owner && can(m.role, "library.write");
  const url = new URL(request.url);
  const query = readQuery(url, LibraryQuery);
  const sys = m.user.units;
  const qp = (k: "q" | "type" | "size" | "speed" | "flow" | "head" | "sort") => query[k];
  // The forms' strict reader: junk, 0x10 or an ambiguous 1,500 means no filter.
  const numIn = (k: "flow" | "head", q: "flow" | "head") => {
    const x = positiveFilter(qp(k));
    return x === undefined ? undefined : fromChosen(sys, q, x);
  };
  const sort = qp("sort");
  const filters = {
    q: qp("q").slice(0, 80) || undefined,
    type: qp("type").slice(0, 40) || undefined,
    size: qp("size").slice(0, 40) || undefined,
    speed: positiveFilter(qp("speed")),
    flow: numIn("flow", "flow"),
    head: numIn("head", "head"),
    sort: (sort === "flow" || sort === "head" ? sort : "name") as "name" | "flow" | "head",
  };
  const [models, revisions, pending, imports] = await Promise.all([
    locked || !lib.currentRevisionId ? Promise.resolve([]) : revisionModelList(lib.currentRevisionId, filters), // lib opened for the viewer above
    locked ? Promise.resolve([]) : listRevisions(id),
    writer ? pendingUploads(id) : Promise.resolve([]),
    writer ? recentImports(id) : Promise.resolve([]),
  ]);
  const paging = pageOf(models.length, MODEL_PAGE_ROWS, query.page);
  const shown = models.slice(paging.first, paging.first + MODEL_PAGE_ROWS);
  // The model asked for when it is one of the listed (filtered) models of the current revision, else the page's first.
  const asked = query.model ? models.find((mm) => mm.id === query.model) : undefined;
  const chosen = asked ?? shown[0];
  // One of the listed models of the revision just read: only its curve sets are read (no second access check).
  const selected = chosen ? { model: chosen, curves: await modelCurves(lib.currentRevisionId!, chosen.id) } : null;
  return {
    lib: { id: lib.id, name: lib.name, description: lib.description, visibility: lib.visibility, owner: lib.ownerName, access: lib.access },
    locked,
    writer,
    canPublish: owner && can(m.role, "library.publish"),
    unitSystem: sys,
    filters: { q: qp("q"), type: qp("type"), size: qp("size"), speed: qp("speed"), flow: qp("flow"), head: qp("head"), sort: filters.sort },
    paging,
    modelMissing: query.model && !asked ? query.model : null,
    models: shown.map((mm) => ({
      id: mm.id,
      name: mm.name,
      type: mm.type,
      size: mm.size,
      curveCount: mm.curves.length,
      flowMax: Math.max(...mm.curves.map((c) => c.flowMax)),
      headMax: Math.max(...mm.curves.map((c) => c.headMax)),
      speeds: [...new Set(mm.curves.map((c) => c.speed).filter((x): x is number => x != null))],
    })),
    modelId: selected?.model.id ?? null,
    modelName: selected?.model.name ?? "",
    curves: (selected?.curves ?? []).map((c) => ({ id: c.id, speed: c.speed, impellerDiameter: c.impellerDiameter, minFlow: c.minFlow ?? null, points: c.points })), // what the page shows (minFlow: the maker's minimum continuous flow, m³/s, or null)
    revisions: revisions.map((r) => ({ id: r.id, number: r.number, note: r.note, curves: r.curveCount, points: r.pointCount, skipped: r.skippedCount, at: r.createdAt.toISOString() })),
    pending: pending.map((p) => ({ ...p, createdAt: p.createdAt.toISOString() })),
    imported: query.imported,
    imports,
    importId: query.import,
    refreshHref: `${url.pathname}${url.search}#imports`,
  };
}

const Settings = v.object({
  name: Name("a library name"),
  description: FreeText("description", 1000),
  visibility: v.picklist(VISIBILITIES, "Pick who sees the library."),
});

export async function action({ request, params }: Route.ActionArgs) {
  const m = await requireMember(request, "library.write");
  const id = readId(params.id);
  const form = await readFormSafe(request.clone());
  if (form.get("intent") === "delete") {
    const how = await deleteLibrary(viewerOf(m), id);
    throw redirect(`/libraries?${how}=1`);
  }
  const r = await readForm(request, Settings);
  if (!r.ok) return invalid(r.errors);
  await updateLibrary(viewerOf(m), id, r.value);
  return { notice: "Library saved." };
}

const VIS_LABEL = {
  private: "Private draft — only people who edit libraries in this workspace",
  workspace: "Whole workspace — everyone in this workspace",
  shared: "Shared — published to every subscriber of the Network plan",
} as const;

export default function LibraryPage() {
  const d = useLoaderData<typeof loader>();
  const { errors, notice } = useFormResult();
  // A model's link keeps the filters and the page of the list.
  const listQuery = Object.entries(d.filters).filter(([, x]) => x);
  const modelHref = (id: number) => `?${new URLSearchParams([...listQuery, ...(d.paging.page > 1 ? [["page", String(d.paging.page)]] : []), ["model", String(id)]])}`;
  return (
    <div className="space-y-6">
      <PageHead
        trail={[["/libraries", "Pump libraries"]]}
        title={d.lib.name}
        badge={<AccessBadge access={d.lib.access} visibility={d.lib.visibility} />}
        line={[`by ${d.lib.owner}`, d.lib.description]}
      />
      <FormOutcome notice={notice} error={errors._form} />
      {d.locked ? (
        <section className="panel">
          <p className="caution">
            This library is shared by {d.lib.owner} with subscribers of the Network plan. Its curves open when your workspace upgrades.
          </p>
          <p className="mt-3">
            <a className="btn" href="/workspace/billing">
              See plans
            </a>
          </p>
        </section>
      ) : (
        <>
          <section className="panel space-y-3">
            <div className="flex flex-wrap items-baseline justify-between gap-2">
              <h2 className="text-lg font-semibold">Pump models</h2>
              <p className="text-sm">
                Export: <a href={`/libraries/${d.lib.id}/export.csv`}>CSV</a> · <a href={`/libraries/${d.lib.id}/export.json`}>JSON</a>
              </p>
            </div>
            {d.imported ? <Notice>Revision {d.imported} imported.</Notice> : null}
            {d.importId ? <Notice>Import {d.importId} started: its progress is shown under Imports below; you can leave this page and come back.</Notice> : null}
            <Form method="get" className="flex flex-wrap items-end gap-2 text-sm" aria-label="Filter models">
              <label>
                <span className="label">Name</span>
                <input name="q" defaultValue={d.filters.q} className="field w-32" />
              </label>
              <label>
                <span className="label">Type</span>
                <input name="type" defaultValue={d.filters.type} className="field w-28" />
              </label>
              <label>
                <span className="label">Size</span>
                <input name="size" defaultValue={d.filters.size} className="field w-24" />
              </label>
              <label>
                <span className="label">Speed (rpm)</span>
                <input name="speed" inputMode="numeric" defaultValue={d.filters.speed} className="field w-20" />
              </label>
              <label>
                <span className="label">Reaches flow ({labelOf(d.unitSystem, "flow")})</span>
                <input name="flow" inputMode="decimal" defaultValue={d.filters.flow} className="field w-24" />
              </label>
              <label>
                <span className="label">and head ({labelOf(d.unitSystem, "head")})</span>
                <input name="head" inputMode="decimal" defaultValue={d.filters.head} className="field w-20" />
              </label>
              <label>
                <span className="label">Sort by</span>
                <select name="sort" defaultValue={d.filters.sort} className="field w-auto">
                  <option value="name">name</option>
                  <option value="flow">largest flow</option>
                  <option value="head">largest head</option>
                </select>
              </label>
              <button className="btn-quiet">Filter</button>
            </Form>
            {d.modelMissing ? <Notice>Model {d.modelMissing} is not among this library&apos;s current models (or the filters hide it); the first listed is shown.</Notice> : null}
            {d.models.length === 0 ? (
              <p className="text-sm text-slate-600">No models{d.writer ? " yet: upload a vendor CSV below." : " match."}</p>
            ) : (
              <div className="grid gap-4 lg:grid-cols-[minmax(18rem,26rem)_1fr]">
                <div>
                  <div className="max-h-[36rem] overflow-y-auto">
                    <ListTable head={["Model", "Curves", "Max flow", "Max head"]} className="" label="Models" sticky>
                      {d.models.map((mm) => (
                        <tr key={mm.id} className={`border-t border-slate-100 ${mm.id === d.modelId ? "bg-brand-50" : ""}`}>
                          <td className="py-1">
                            <a href={modelHref(mm.id)} aria-current={mm.id === d.modelId ? "true" : undefined} className="font-semibold">
                              {mm.name}
                            </a>
                            <div className="text-xs text-slate-600">{[mm.type, mm.size, mm.speeds.map((x) => `${Math.round(x)} rpm`).join("/")].filter(Boolean).join(" · ")}</div>
                          </td>
                          <td>{mm.curveCount}</td>
                          <td>{fmtFlow(d.unitSystem, mm.flowMax)}</td>
                          <td>{fmtHead(d.unitSystem, mm.headMax)}</td>
                        </tr>
                      ))}
                    </ListTable>
                  </div>
                  {d.paging.pages > 1 ? (
                    <p className="mt-2 text-sm text-slate-600">
                      Models {fmtInt(d.paging.first + 1)}–{fmtInt(d.paging.first + d.models.length)} of {fmtInt(d.paging.total)}
                    </p>
                  ) : null}
                  <Pager label="Model pages" paging={d.paging} />
                </div>
                <div className="space-y-3">
                  <CurvePreview
                    unitSystem={d.unitSystem}
                    title={`Curves of ${d.modelName}`}
                    curves={d.curves.map((c) => ({ id: String(c.id), label: renderUnits(curveLabel(c.speed, c.impellerDiameter), d.unitSystem), points: c.points }))}
                  />
                  <details>
                    <summary className="cursor-pointer text-sm font-semibold">Point tables of {d.modelName}</summary>
                    {d.curves.map((c) => {
                      const label = renderUnits(curveLabel(c.speed, c.impellerDiameter), d.unitSystem);
                      // The caption shows the curve's label and names the table for screen readers (with the model, unseen).
                      const caption = (
                        <>
                          <span className="sr-only">Points of {d.modelName} </span>
                          {label}
                          {c.minFlow != null ? (
                            <>
                              {" "}
                              <span className="block font-normal text-slate-600">Maker&apos;s minimum continuous flow: {fmtFlow(d.unitSystem, c.minFlow)}</span>
                            </>
                          ) : null}
                        </>
                      );
                      return (
                        <ListTable key={c.id} head={["Flow", "Head", "Efficiency", "Shaft power", "NPSHr"]} small caption={caption}>
                          {c.points.map((p, i) => (
                            <tr key={i} className="border-t border-slate-100">
                              <td>{fmtFlow(d.unitSystem, p.flow)}</td>
                              <td>{fmtHead(d.unitSystem, p.head)}</td>
                              <td>{fmtPct(p.efficiency)}</td>
                              <td>{fmtPower(d.unitSystem, p.power)}</td>
                              <td>{p.npshr == null ? "—" : fmtHead(d.unitSystem, p.npshr)}</td>
                            </tr>
                          ))}
                        </ListTable>
                      );
                    })}
                  </details>
                </div>
              </div>
            )}
          </section>
          {d.revisions.length ? (
            <section className="panel">
              <h2 className="text-lg font-semibold">Revisions</h2>
              <ListTable head={["#", "Imported", "Curves", "Points", "Skipped", "Note"]}>
                {d.revisions.map((r, i) => (
                  <tr key={r.id} className="border-t border-slate-100">
                    <td className="py-1">
                      {r.number}
                      {i === 0 ? <span className="ml-1 text-xs text-brand-700">current</span> : null}
                    </td>
                    <td>{fmtUtc(r.at)}</td>
                    <td>{fmtInt(r.curves)}</td>
                    <td>{fmtInt(r.points)}</td>
                    <td>{fmtInt(r.skipped)}</td>
                    <td>{r.note}</td>
                  </tr>
                ))}
              </ListTable>
            </section>
          ) : null}
        </>
      )}
      {d.writer ? <ImportList imports={d.imports} refreshHref={d.refreshHref} highlight={d.importId} /> : null}
      {d.writer ? (
        <section className="panel space-y-3">
          <h2 className="text-lg font-semibold">Import vendor curves</h2>
          <p className="text-sm text-slate-600">
            CSV exports (comma, semicolon or tab; decimal point or comma), one row per point or one column block per impeller or speed. Up
            to 20 MB a file. You map the columns and see every flagged row before anything is imported.
          </p>
          <UploadDrop action={`/libraries/${d.lib.id}/upload`} />
          <p className="text-sm">
            Curves only on a PDF datasheet or a scanned page?{" "}
            <a href={`/libraries/${d.lib.id}/trace`} data-testid="trace-link">Trace a curve</a> from the picture instead.
          </p>
          {d.pending.length ? (
            <div>
              <h3 className="font-semibold">Waiting for import</h3>
              <ul className="text-sm">
                {d.pending.map((p) => (
                  <li key={p.id}>
                    <a href={`/libraries/${d.lib.id}/uploads/${p.id}`}>{p.filename}</a> · {fmtBytes(p.sizeBytes)} · uploaded{" "}
                    {fmtUtc(p.createdAt)}
                  </li>
                ))}
              </ul>
            </div>
          ) : null}
        </section>
      ) : null}
      {d.writer ? (
        <section className="panel">
          <h2 className="text-lg font-semibold">Library settings</h2>
          <Form method="post" className="mt-2 grid max-w-xl gap-3">
            <Field label="Name" name="name" defaultValue={d.lib.name} error={errors.name} required />
            <Field label="Description" name="description" defaultValue={d.lib.description} error={errors.description} />
            <fieldset>
              <legend className="label">Who sees it</legend>
              {VISIBILITIES.map((vis) => (
                <label key={vis} className="mt-1 flex items-center gap-2 text-sm">
                  <input type="radio" name="visibility" value={vis} defaultChecked={d.lib.visibility === vis} disabled={!d.canPublish && vis !== d.lib.visibility} />
                  {VIS_LABEL[vis]}
                </label>
              ))}
            </fieldset>
            <div>
              <button className="btn">Save</button>
            </div>
          </Form>
          {d.canPublish ? (
            <Form method="post" className="mt-4 border-t border-slate-200 pt-3">
              <p className="text-xs text-slate-600">Deleting removes the library; when selections still use its curves it is archived instead (they keep their frozen copies).</p>
              <button className="mt-1 rounded-md border border-fail px-3 py-1 text-sm font-semibold text-fail" name="intent" value="delete">
                Delete library
              </button>
            </Form>
          ) : null}
        </section>
      ) : null}
    </div>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "this pump library", back: { href: "/libraries", label: "All pump libraries" } });
