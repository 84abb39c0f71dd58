import * as v from "valibot";
import { Form, useLoaderData } from "react-router";
import type { Route } from "./+types/libraries";
import { createAsMember, requireMember } from "~/lib/auth/guards.server";
import { viewerOf } from "~/lib/auth/viewer.server";
import { createLibrary, listLibraries } from "~/lib/libraries";
import { can } from "~/lib/auth/permissions";
import { FreeText, Name } from "~/lib/shared/forms.server";
import { Field, FormError, PageWorkspaceField } from "~/components/forms";
import { AccessBadge } from "~/components/library-bits";
import { routeErrorBoundary } from "~/components/RouteError";
import { useFormResult } from "~/components/useFormResult";
import { ListTable, NameCell } from "~/components/ListTable";
import { fmtInt } from "~/lib/shared/format";

export const meta: Route.MetaFunction = () => [{ title: "Pump libraries · Dutymark" }];

export async function loader({ request }: Route.LoaderArgs) {
  const m = await requireMember(request, "library.read");
  const list = await listLibraries(viewerOf(m));
  return { list, canWrite: can(m.role, "library.write"), workspace: m.workspace };
}

/** The new library's fields; the page's workspace is read beside them (`createAsMember`). */
const Schema = v.object({
  name: Name("a library name"),
  description: FreeText("description", 1000),
});

export const action = ({ request }: Route.ActionArgs) => createAsMember(request, "library.write", Schema, createLibrary, (id) => `/libraries/${id}`);

export default function Libraries() {
  const d = useLoaderData<typeof loader>();
  const { errors } = useFormResult();
  const own = d.list.filter((l) => l.access === "owner");
  const shared = d.list.filter((l) => l.access !== "owner");
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-bold text-brand-900">Pump libraries</h1>
      <section className="panel">
        <h2 className="text-lg font-semibold">{d.workspace.name}</h2>
        <LibraryTable list={own} empty="No libraries in this workspace yet." />
      </section>
      <section className="panel">
        <h2 className="text-lg font-semibold">Shared by distributors</h2>
        {d.workspace.plan !== "network" && shared.some((l) => l.access === "locked") ? (
          <p className="caution mt-2">
            Shared libraries open with the Network plan. Your workspace is on the Starter plan: you can see what is offered, not the curves.{" "}
            <a href="/workspace/billing">See plans</a>
          </p>
        ) : null}
        <LibraryTable list={shared} empty="No distributor has shared a library yet." />
      </section>
      {d.canWrite ? (
        <section className="panel">
          <h2 className="text-lg font-semibold">New library</h2>
          <Form method="post" className="mt-2 grid max-w-xl gap-3">
            <PageWorkspaceField id={d.workspace.id} />
            <FormError error={errors._form ?? errors.pageWorkspaceId} />
            <Field label="Name" name="name" error={errors.name} required />
            <Field label="Description" name="description" error={errors.description} hint="What pumps, which vendor, which speeds." />
            <div>
              <button className="btn">Create library</button>
            </div>
          </Form>
        </section>
      ) : null}
    </div>
  );
}

function LibraryTable({ list, empty }: { list: ReturnType<typeof useLoaderData<typeof loader>>["list"]; empty: string }) {
  if (list.length === 0) return <p className="mt-2 text-sm text-slate-600">{empty}</p>;
  return (
    <ListTable head={["Library", "Owner", "Models", "Curves", "Revision", "Access"]}>
      {list.map((l) => (
        <tr key={l.id} className="border-t border-slate-100 align-top">
          <NameCell href={`/libraries/${l.id}`} name={l.name}>
            {l.description ? <div className="text-xs text-slate-600">{l.description}</div> : null}
          </NameCell>
          <td>{l.owner}</td>
          <td>{fmtInt(l.modelCount)}</td>
          <td>{fmtInt(l.curveCount)}</td>
          <td>{l.revision ? `#${l.revision}` : "—"}</td>
          <td>
            <AccessBadge access={l.access} visibility={l.visibility} />
          </td>
        </tr>
      ))}
    </ListTable>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "the pump libraries", back: { href: "/", label: "The start page" } });
