import * as v from "valibot";
import { Form, redirect, useLoaderData } from "react-router";
import type { Route } from "./+types/projects.$id";
import { requireMember } from "~/lib/auth/guards.server";
import { copyProject, createSystem, getProject, listSelections, listSystems, setProjectArchived, updateProject } from "~/lib/projects";
import { viewerOf } from "~/lib/auth/viewer.server";
import { can } from "~/lib/auth/permissions";
import { FreeText, invalid, Name, readForm, readId } from "~/lib/shared/forms.server";
import { Field, FormOutcome } from "~/components/forms";
import { ReadOnlyNotice } from "~/components/ReadOnlyNotice";
import { routeErrorBoundary } from "~/components/RouteError";
import { PageHead } from "~/components/PageHead";
import { PostButton } from "~/components/PostButton";
import { useFormResult } from "~/components/useFormResult";
import { renderDeep, fmtFlow, fmtHead } from "~/lib/shared/units";
import { fmtDate } from "~/lib/shared/format";
import { ListTable, NameCell } from "~/components/ListTable";

export const meta: Route.MetaFunction = ({ data }) => [{ title: `${data?.project.name ?? "Project"} · Dutymark` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const m = await requireMember(request, "project.read");
  const id = readId(params.id);
  const viewer = viewerOf(m);
  const p = await getProject(viewer, id);
  return {
    project: { id: p.id, name: p.name, site: p.site, description: p.description, archived: p.archivedAt != null },
    systems: await listSystems(viewer, id),
    selections: renderDeep(await listSelections(viewer, { projectId: id }), m.user.units), // titles name the impeller in the reader's units
    role: m.role,
    canWrite: can(m.role, "project.write"),
    unitSystem: m.user.units,
  };
}

const Intent = v.variant("intent", [
  v.object({ intent: v.literal("new-system"), name: Name("a system name", 160) }),
  v.object({
    intent: v.literal("edit"),
    name: Name("a project name", 160),
    site: FreeText("site", 200),
    description: FreeText("description", 2000),
  }),
  v.object({ intent: v.literal("copy") }),
  v.object({ intent: v.literal("archive") }),
  v.object({ intent: v.literal("restore") }),
]);

export async function action({ request, params }: Route.ActionArgs) {
  const m = await requireMember(request, "project.write");
  const id = readId(params.id);
  const viewer = viewerOf(m);
  const r = await readForm(request, Intent);
  if (!r.ok) return invalid(r.errors);
  const f = r.value;
  switch (f.intent) {
    case "new-system": {
      const sid = await createSystem(viewer, id, f.name);
      throw redirect(`/systems/${sid}`);
    }
    case "edit":
      await updateProject(viewer, id, f);
      return { notice: "Project saved." };
    case "copy":
      throw redirect(`/projects/${await copyProject(viewer, id)}`);
    case "archive":
    case "restore":
      await setProjectArchived(viewer, id, f.intent === "archive");
      return { notice: f.intent === "archive" ? "Project archived." : "Project restored." };
  }
}

export default function ProjectPage() {
  const d = useLoaderData<typeof loader>();
  const { errors, notice } = useFormResult();
  return (
    <div className="space-y-6">
      <PageHead
        trail={[["/projects", "Projects"]]}
        title={d.project.name}
        badge={d.project.archived ? <span className="text-sm font-normal text-slate-500">(archived)</span> : null}
        line={[d.project.site, d.project.description]}
      />
      {!d.canWrite ? <ReadOnlyNotice what="project" role={d.role} /> : null}
      <FormOutcome notice={notice} error={errors._form} />
      <section className="panel">
        <h2 className="text-lg font-semibold">Systems</h2>
        {d.systems.length === 0 ? (
          <p className="mt-2 text-sm text-slate-600">No systems yet.</p>
        ) : (
          <ListTable head={["System", "Kind", "Duty"]}>
            {d.systems.map((s) => (
              <tr key={s.id} className="border-t border-slate-100">
                <NameCell href={`/systems/${s.id}`} name={s.name} />
                {s.needsReview ? (
                  // Stored inputs that do not pass the checks: nothing read from them is shown (never a default duty).
                  <td colSpan={2} className="text-fail" data-testid={`needs-review-${s.id}`}>
                    Needs review: the stored inputs fail {s.needsReview.problems} check{s.needsReview.problems === 1 ? "" : "s"} ({s.needsReview.places}); nothing is computed until they are fixed.
                  </td>
                ) : (
                  <>
                    <td>{s.mode === "closed-loop" ? "closed loop" : "open (static lift)"}</td>
                    <td>{s.duty ? `${fmtFlow(d.unitSystem, s.duty.flow)} at ${fmtHead(d.unitSystem, s.duty.head)}` : "—"}</td>
                  </>
                )}
              </tr>
            ))}
          </ListTable>
        )}
        {d.canWrite ? (
          <Form method="post" className="mt-3 flex flex-wrap items-end gap-3">
            <input type="hidden" name="intent" value="new-system" />
            <Field label="New system" name="name" placeholder="e.g. Chilled-water primary loop" error={errors.name} required />
            <button className="btn">Add system</button>
          </Form>
        ) : null}
      </section>
      <section className="panel">
        <h2 className="text-lg font-semibold">Selections</h2>
        {d.selections.length === 0 ? (
          <p className="mt-2 text-sm text-slate-600">No pump selected yet.</p>
        ) : (
          <ul className="mt-2 space-y-1 text-sm">
            {d.selections.map((s) => (
              <li key={s.id}>
                <a href={`/selections/${s.id}`} className="font-semibold">
                  {s.title}
                </a>{" "}
                for {s.systemName} · {fmtDate(s.createdAt)}
              </li>
            ))}
          </ul>
        )}
      </section>
      {d.canWrite ? (
        <section className="panel space-y-3">
          <h2 className="text-lg font-semibold">Project details</h2>
          <Form method="post" className="grid max-w-xl gap-3">
            <input type="hidden" name="intent" value="edit" />
            <Field label="Name" name="name" defaultValue={d.project.name} error={errors.name} required />
            <Field label="Site" name="site" defaultValue={d.project.site} />
            <Field label="Description" name="description" defaultValue={d.project.description} />
            <div>
              <button className="btn">Save</button>
            </div>
          </Form>
          <div className="flex flex-wrap gap-2">
            <a className="btn-quiet" href={`/projects/${d.project.id}/share`}>
              Share with a contractor
            </a>
            <PostButton intent="copy">
              Copy project
            </PostButton>
            <PostButton intent={d.project.archived ? "restore" : "archive"}>
              {d.project.archived ? "Restore" : "Archive"}
            </PostButton>
          </div>
        </section>
      ) : null}
    </div>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "this project", back: { href: "/projects", label: "Your projects" } });
