import { data } from "react-router";
import type { Route } from "./+types/libraries.$id.trace";
import { requireMember } from "~/lib/auth/guards.server";
import { viewerOf } from "~/lib/auth/viewer.server";
import { formId, readFormSafe, readId } from "~/lib/shared/forms.server";
import { listPictures, MAX_PICTURE_BYTES } from "~/lib/tracer/pictures.server";
import { deletePicture, pictureUse } from "~/lib/tracer/picture-delete.server";
import { FormOutcome } from "~/components/forms";
import { PostButton } from "~/components/PostButton";
import { fmtBytes } from "~/components/library-bits";
import { JsNotice } from "~/components/tracer/JsNotice";
import { routeErrorBoundary } from "~/components/RouteError";
import { PageHead } from "~/components/PageHead";

export const meta: Route.MetaFunction = () => [{ title: "Trace a curve · Dutymark" }];

// GET /libraries/:id/trace — bring a datasheet picture (PDF, PNG or JPEG) to trace curves from.
export async function loader({ request, params }: Route.LoaderArgs) {
  const m = await requireMember(request, "library.write");
  const { lib, pictures } = await listPictures(viewerOf(m), readId(params.id));
  const use = await pictureUse(lib.id);
  return { lib: { id: lib.id, name: lib.name }, pictures: pictures.map((p) => ({ ...p, traced: use.traced.get(p.id) ?? 0 })), total: use.pictures, maxBytes: MAX_PICTURE_BYTES };
}

// POST intent=delete pictureId=N — a picture nothing was traced from; one traced from is kept (its revisions name it).
export async function action({ request, params }: Route.ActionArgs) {
  const m = await requireMember(request, "library.write");
  const form = await readFormSafe(request);
  if (form.get("intent") !== "delete") throw data("Unknown action: this page only deletes a picture.", { status: 400 });
  const r = await deletePicture(viewerOf(m), readId(params.id), formId(form, "pictureId"));
  if (!r.deleted) return data({ notice: null, error: r.reason }, { status: 409 }); // conflicts with the uploads traced from it (RFC 9110 §15.5.10; was 200)
  return { notice: `${r.filename} deleted.`, error: undefined };
}

export default function TraceStart({ loaderData: d, actionData: a }: Route.ComponentProps) {
  return (
    <div className="space-y-6">
      <FormOutcome notice={a?.notice} error={a?.error} />
      <PageHead trail={[["/libraries", "Pump libraries"], [`/libraries/${d.lib.id}`, d.lib.name]]} title="Trace a curve">
        <p className="text-sm text-slate-600">
          From a PDF datasheet or a scanned page: calibrate the axes, follow each curve by clicking or by its colour, then check and import
          the points like a CSV file.
        </p>
      </PageHead>
      <JsNotice>The tracer itself runs in the browser and needs JavaScript. Storing a picture works without it.</JsNotice>
      <section className="panel space-y-3">
        <h2 className="text-lg font-semibold">Bring the picture</h2>
        <form method="post" action={`/libraries/${d.lib.id}/trace/upload`} encType="multipart/form-data" className="flex flex-wrap items-end gap-3">
          <label className="space-y-1">
            <span className="label">PDF, PNG or JPEG, up to {fmtBytes(d.maxBytes)}</span>
            <input type="file" name="file" accept="application/pdf,image/png,image/jpeg,.pdf,.png,.jpg,.jpeg" required className="block text-sm" data-testid="picture-file" />
          </label>
          <button type="submit" className="btn">Store and open</button>
        </form>
        <p className="text-xs text-slate-500">The original is kept unchanged with its SHA-256 checksum beside the revisions it leads to.</p>
      </section>
      {d.pictures.length ? (
        <section className="panel">
          <h2 className="text-lg font-semibold">Pictures of this library</h2>
          {d.total > d.pictures.length ? <p className="text-xs text-slate-600">The newest {d.pictures.length} of {d.total}.</p> : null}
          <ul className="space-y-1 text-sm">
            {d.pictures.map((p) => (
              <li key={p.id} className="flex flex-wrap items-center gap-x-2" data-testid={`picture-${p.id}`}>
                <span>
                  <a href={`/libraries/${d.lib.id}/trace/${p.id}`}>{p.filename}</a> · {p.contentType} · {fmtBytes(p.sizeBytes)} · SHA-256{" "}
                  <code>{p.sha256.slice(0, 12)}…</code>
                </span>
                {p.traced ? (
                  <span className="text-xs text-slate-500">kept: {p.traced} upload{p.traced === 1 ? "" : "s"} traced from it</span>
                ) : (
                  <PostButton intent="delete" field="pictureId" id={p.id} className="btn-quiet py-0.5 text-xs">
                    Delete
                  </PostButton>
                )}
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "the curve tracer for this library", back: { href: "/libraries", label: "All pump libraries" } });
