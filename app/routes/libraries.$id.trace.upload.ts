import { data, redirect } from "react-router";
import type { Route } from "./+types/libraries.$id.trace.upload";
import { requireMember } from "~/lib/auth/guards.server";
import { viewerOf } from "~/lib/auth/viewer.server";
import { readId, readFormSafe } from "~/lib/shared/forms.server";
import { getLibrary, UploadRejected } from "~/lib/libraries";
import { storePicture } from "~/lib/tracer/pictures.server";

// POST /libraries/:id/trace/upload (multipart, field "file"): stores a datasheet picture and opens it
// in the tracer. The path ends in /upload, so the uploads' body limit applies (app/root.tsx, serve.mjs).
export async function loader({ request, params }: Route.LoaderArgs) {
  // A GET here (a reload after posting) goes back to the tracer — only of a library this workspace may see: 404 else, as there.
  const m = await requireMember(request, "library.read");
  const id = readId(params.id);
  await getLibrary(viewerOf(m), id);
  throw redirect(`/libraries/${id}/trace`);
}

export async function action({ request, params }: Route.ActionArgs) {
  const m = await requireMember(request, "library.write");
  const id = readId(params.id);
  let form: FormData;
  try {
    form = await readFormSafe(request);
  } catch {
    throw data("The upload could not be read.", { status: 400 });
  }
  const file = form.get("file");
  if (!(file instanceof File)) throw data("Choose a PDF, PNG or JPEG file.", { status: 400 });
  try {
    const pictureId = await storePicture(viewerOf(m), id, file);
    throw redirect(`/libraries/${id}/trace/${pictureId}`);
  } catch (e) {
    if (e instanceof UploadRejected) throw data(e.message, { status: 422 });
    throw e;
  }
}
