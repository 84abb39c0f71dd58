import * as v from "valibot";
import { data, redirect } from "react-router";
import type { Route } from "./+types/libraries.$id.trace.$pictureId";
import { requireMember } from "~/lib/auth/guards.server";
import { viewerOf } from "~/lib/auth/viewer.server";
import { invalid, readForm, readId } from "~/lib/shared/forms.server";
import { UploadRejected } from "~/lib/libraries";
import { getPicture, MAX_TRACED_CSV_BYTES, storeTracedCsv } from "~/lib/tracer/pictures.server";
import { TRACE_CAUTION } from "~/lib/tracer/sniff";
import { FormError, Notice } from "~/components/forms";
import { JsNotice } from "~/components/tracer/JsNotice";
import { TracerWorkbench } from "~/components/tracer/TracerWorkbench";
import { routeErrorBoundary } from "~/components/RouteError";
import { PageHead } from "~/components/PageHead";

export const meta: Route.MetaFunction = () => [{ title: "Trace a curve · Dutymark" }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const m = await requireMember(request, "library.write");
  const { lib, picture } = await getPicture(viewerOf(m), readId(params.id), readId(params.pictureId));
  return {
    lib: { id: lib.id, name: lib.name },
    picture: { id: picture.id, filename: picture.filename, type: picture.contentType, sha256: picture.sha256 },
    units: { flow: m.user.units.flow, head: m.user.units.head },
  };
}

const ImportSchema = v.object({
  intent: v.literal("import"),
  csv: v.pipe(v.string(), v.minLength(1, "Nothing was traced yet."), v.maxLength(MAX_TRACED_CSV_BYTES, "Too many traced points.")),
  page: v.optional(v.pipe(v.string(), v.regex(/^\d{1,6}$/, "Bad page number."), v.transform(Number))),
  // What the page did not trace (the peak inside the innermost contour: lib/tracer/peak.ts), for the source line.
  note: v.optional(v.pipe(v.string(), v.maxLength(2000, "The note on the traced points is too long.")), ""),
});

// POST intent=import: the traced points (our CSV, built in the page) become an upload of the library
// and the user continues on that upload's mapping page: same checks, same report, same import.
export async function action({ request, params }: Route.ActionArgs) {
  const m = await requireMember(request, "library.write");
  const libraryId = readId(params.id);
  const pictureId = readId(params.pictureId);
  const r = await readForm(request, ImportSchema);
  if (!r.ok) throw invalid(r.errors);
  try {
    const uploadId = await storeTracedCsv(viewerOf(m), libraryId, pictureId, r.value.csv, r.value.page ?? null, r.value.note);
    throw redirect(`/libraries/${libraryId}/uploads/${uploadId}`);
  } catch (e) {
    if (e instanceof UploadRejected) return data({ error: e.message }, { status: 422 }); // as the upload routes (was 200)
    throw e;
  }
}

export default function TracePicture({ loaderData: d, actionData }: Route.ComponentProps) {
  return (
    <div className="space-y-4">
      <PageHead trail={[["/libraries", "Pump libraries"], [`/libraries/${d.lib.id}`, d.lib.name], [`/libraries/${d.lib.id}/trace`, "Trace a curve"]]} title={`Trace: ${d.picture.filename}`}>
        <p className="text-xs text-slate-500">
          {d.picture.type} · SHA-256 {d.picture.sha256.slice(0, 16)}…
        </p>
      </PageHead>
      <JsNotice>The tracer runs in the browser and needs JavaScript: turn it on to calibrate and trace this picture.</JsNotice>
      <Notice>{TRACE_CAUTION}</Notice>
      <FormError error={actionData && "error" in actionData ? actionData.error : undefined} />
      <TracerWorkbench
        src={`/libraries/${d.lib.id}/trace/${d.picture.id}/file`}
        type={d.picture.type}
        filename={d.picture.filename}
        units={d.units}
      />
    </div>
  );
}

export const ErrorBoundary = routeErrorBoundary({ what: "this traced picture", back: { href: "/libraries", label: "All pump libraries" } });
