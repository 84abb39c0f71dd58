import * as v from "valibot";
import { Form, useLoaderData } from "react-router";
import type { Route } from "./+types/projects";
import { createAsMember, requireMember } from "~/lib/auth/guards.server";
import { createProject, listProjects } from "~/lib/projects";
import { viewerOf } from "~/lib/auth/viewer.server";
import { can } from "~/lib/auth/permissions";
import { FreeText, Name, QueryFlag, readQuery } from "~/lib/shared/forms.server";
import { Field, FormError, PageWorkspaceField } from "~/components/forms";
import { routeErrorBoundary } from "~/components/RouteError";
import { useFormResult } from "~/components/useFormResult";
import { ListTable, NameCell } from "~/components/ListTable";

export const meta: Route.MetaFunction = () => [{ title: "Projects · Dutymark" }];

export async function loader({ request }: Route.LoaderArgs) {
  const m = await requireMember(request, "project.read");
  const { archived } = readQuery(request.url, v.object({ archived: QueryFlag }));
  return { list: await listProjects(viewerOf(m), { archived }), canWrite: can(m.role, "project.write"), archived, workspace: m.workspace.name, workspaceId: m.workspace.id };
}

/** The new project's fields; the page's workspace is read beside them (`createAsMember`). */
const Schema = v.object({
  name: Name("a project name", 160),
  site: FreeText("site", 200),
  description: FreeText("description", 2000),
});

export const action = ({ request }: Route.ActionArgs) => createAsMember(request, "project.write", Schema, createProject, (id) => `/projects/${id}`);

export default function Projects() {
  const d = useLoaderData<typeof loader>();
  const { errors } = useFormResult();
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h1 className="text-2xl font-bold text-brand-900">{d.archived ? "Archived projects" : "Projects"}</h1>
        <a href={d.archived ? "/projects" : "/projects?archived=1"} className="text-sm">
          {d.archived ? "Back to active projects" : "Show archived projects"}
        </a>
      </div>
      <section className="panel">
        {d.list.length === 0 ? (
          <p className="text-sm text-slate-600">{d.archived ? "No archived projects." : `No projects in ${d.workspace} yet.`}</p>
        ) : (
          <ListTable head={["Project", "Site", "Systems", "Selections"]} className="">
            {d.list.map((p) => (
              <tr key={p.id} className="border-t border-slate-100">
                <NameCell href={`/projects/${p.id}`} name={p.name} />
                <td>{p.site}</td>
                <td>{p.systems}</td>
                <td>{p.selections}</td>
              </tr>
            ))}
          </ListTable>
        )}
      </section>
      {d.canWrite && !d.archived ? (
        <section className="panel">
          <h2 className="text-lg font-semibold">New project</h2>
          <Form method="post" className="mt-2 grid max-w-xl gap-3">
            <PageWorkspaceField id={d.workspaceId} />
            <FormError error={errors._form ?? errors.pageWorkspaceId} />
            <Field label="Name" name="name" error={errors.name} required />
            <Field label="Site" name="site" error={errors.site} hint="Building, plant or address." />
            <Field label="Description" name="description" error={errors.description} />
            <div>
              <button className="btn">Create project</button>
            </div>
          </Form>
        </section>
      ) : null}
    </div>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "your projects", back: { href: "/", label: "The start page" } });
