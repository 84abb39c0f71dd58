import * as v from "valibot";
import { Form, useActionData, useLoaderData } from "react-router";
import type { Route } from "./+types/libraries.$id";
import { requireMember } from "~/lib/guards.server";
import { getLibrary, libraryCurves, listRevisions, pendingUploads, updateLibrary } from "~/lib/libraries.server";
import { can } from "~/lib/permissions";
import { IdField, invalid, Name, readForm } from "~/lib/forms.server";
import { VISIBILITIES } from "~/lib/constants";
import { Field, FormError, Notice } from "~/components/forms";
import { AccessBadge, curveLabel, fmtBytes } from "~/components/library-bits";
import { UploadDrop } from "~/components/UploadDrop";
import { CurvePreview } from "~/components/CurvePreview";

export const meta: Route.MetaFunction = ({ data }) => [{ title: `${data?.lib.name ?? "Library"} · Dutymark` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const m = await requireMember(request, "library.read");
  const viewer = { userId: m.user.id, workspace: m.workspace, role: m.role };
  const id = v.parse(IdField, params.id);
  const lib = await getLibrary(viewer, id);
  const locked = lib.access === "locked";
  const owner = lib.access === "owner";
  const writer = owner && can(m.role, "library.write");
  const [curves, revisions, pending] = await Promise.all([
    locked ? Promise.resolve([]) : libraryCurves(viewer, id),
    locked ? Promise.resolve([]) : listRevisions(id),
    writer ? pendingUploads(id) : Promise.resolve([]),
  ]);
  const url = new URL(request.url);
  const models = [...new Map(curves.map((c) => [c.modelId, { id: c.modelId, name: c.model, type: c.type, size: c.nominalSize }])).values()];
  const modelId = Number(url.searchParams.get("model")) || models[0]?.id;
  return {
    lib: { id: lib.id, name: lib.name, description: lib.description, visibility: lib.visibility, owner: lib.ownerName, access: lib.access },
    locked,
    writer,
    canPublish: owner && can(m.role, "library.publish"),
    unitSystem: m.user.unitSystem,
    models: models.map((mm) => ({ ...mm, curveCount: curves.filter((c) => c.modelId === mm.id).length })),
    modelId,
    curves: curves.filter((c) => c.modelId === modelId),
    revisions: revisions.map((r) => ({ id: r.id, number: r.number, note: r.note, curves: r.curveCount, points: r.pointCount, skipped: r.skippedCount, at: r.createdAt.toISOString() })),
    pending: pending.map((p) => ({ ...p, createdAt: p.createdAt.toISOString() })),
  };
}

const Settings = v.object({
  name: Name("a library name"),
  description: v.pipe(v.string(), v.trim(), v.maxLength(1000, "Keep the description under 1000 characters.")),
  visibility: v.picklist(VISIBILITIES, "Pick who sees the library."),
});

export async function action({ request, params }: Route.ActionArgs) {
  const m = await requireMember(request, "library.write");
  const id = v.parse(IdField, params.id);
  const r = await readForm(request, Settings);
  if (!r.ok) return invalid(r.errors);
  await updateLibrary({ userId: m.user.id, workspace: m.workspace, role: m.role }, id, r.value);
  return { notice: "Library saved." };
}

const VIS_LABEL = {
  private: "Private draft — only people who edit libraries in this workspace",
  workspace: "Whole workspace — everyone in this workspace",
  shared: "Shared — published to every subscriber of the Network plan",
} as const;

export default function LibraryPage() {
  const d = useLoaderData<typeof loader>();
  const a = useActionData<typeof action>() as { errors?: Record<string, string>; notice?: string } | undefined;
  const errors = a?.errors ?? {};
  return (
    <div className="space-y-6">
      <div>
        <p className="text-sm">
          <a href="/libraries">Pump libraries</a> ›
        </p>
        <h1 className="flex flex-wrap items-center gap-3 text-2xl font-bold text-brand-900">
          {d.lib.name} <AccessBadge access={d.lib.access} visibility={d.lib.visibility} />
        </h1>
        <p className="text-sm text-slate-600">
          by {d.lib.owner}
          {d.lib.description ? ` · ${d.lib.description}` : ""}
        </p>
      </div>
      {a?.notice ? <Notice>{a.notice}</Notice> : null}
      <FormError error={errors._form} />
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
          <section className="panel">
            <h2 className="text-lg font-semibold">Pump models</h2>
            {d.models.length === 0 ? (
              <p className="mt-2 text-sm text-slate-600">No curves imported yet{d.writer ? ": upload a vendor CSV below." : "."}</p>
            ) : (
              <div className="mt-2 grid gap-4 lg:grid-cols-[16rem_1fr]">
                <nav aria-label="Models" className="max-h-[32rem] overflow-y-auto">
                  <ul className="space-y-1 text-sm">
                    {d.models.map((mm) => (
                      <li key={mm.id}>
                        <a
                          href={`?model=${mm.id}`}
                          aria-current={mm.id === d.modelId ? "page" : undefined}
                          className={`block rounded px-2 py-1 ${mm.id === d.modelId ? "bg-brand-50 font-semibold" : ""}`}
                        >
                          {mm.name}
                          <span className="ml-1 text-xs text-slate-500">
                            {mm.curveCount} curve{mm.curveCount === 1 ? "" : "s"}
                            {mm.type ? ` · ${mm.type}` : ""}
                          </span>
                        </a>
                      </li>
                    ))}
                  </ul>
                </nav>
                <div>
                  <CurvePreview
                    unitSystem={d.unitSystem}
                    title={`Curves of ${d.models.find((x) => x.id === d.modelId)?.name ?? ""}`}
                    curves={d.curves.map((c) => ({
                      id: String(c.id),
                      label: curveLabel(c.speed, c.impellerDiameter),
                      points: c.points,
                    }))}
                  />
                </div>
              </div>
            )}
          </section>
          {d.revisions.length ? (
            <section className="panel">
              <h2 className="text-lg font-semibold">Revisions</h2>
              <table className="mt-2 w-full text-sm">
                <thead className="text-left text-slate-600">
                  <tr>
                    <th className="py-1">#</th>
                    <th>Imported</th>
                    <th>Curves</th>
                    <th>Points</th>
                    <th>Skipped</th>
                    <th>Note</th>
                  </tr>
                </thead>
                <tbody>
                  {d.revisions.map((r, i) => (
                    <tr key={r.id} className="border-t border-slate-100">
                      <td className="py-1">
                        {r.number}
                        {i === 0 ? <span className="ml-1 text-xs text-brand-700">current</span> : null}
                      </td>
                      <td>{r.at.slice(0, 16).replace("T", " ")} UTC</td>
                      <td>{r.curves}</td>
                      <td>{r.points}</td>
                      <td>{r.skipped}</td>
                      <td>{r.note}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </section>
          ) : null}
        </>
      )}
      {d.writer ? (
        <section className="panel space-y-3">
          <h2 className="text-lg font-semibold">Import vendor curves</h2>
          <p className="text-sm text-slate-600">
            CSV exports (comma, semicolon or tab; decimal point or comma), one row per point or one column block per impeller or speed. Up
            to 20 MB a file. You map the columns and see every flagged row before anything is imported.
          </p>
          <UploadDrop action={`/libraries/${d.lib.id}/upload`} />
          {d.pending.length ? (
            <div>
              <h3 className="font-semibold">Waiting for import</h3>
              <ul className="text-sm">
                {d.pending.map((p) => (
                  <li key={p.id}>
                    <a href={`/libraries/${d.lib.id}/uploads/${p.id}`}>{p.filename}</a> · {fmtBytes(p.sizeBytes)} · uploaded{" "}
                    {p.createdAt.slice(0, 16).replace("T", " ")} UTC
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
        </section>
      ) : null}
    </div>
  );
}
