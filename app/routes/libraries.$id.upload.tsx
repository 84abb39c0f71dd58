import { data, redirect } from "react-router";
import type { Route } from "./+types/libraries.$id.upload";
import { requireMember } from "~/lib/auth/guards.server";
import { viewerOf } from "~/lib/auth/viewer.server";
import { getLibrary, storeUpload, UploadRejected } from "~/lib/libraries";
import { readId, readFormSafe } from "~/lib/shared/forms.server";

// POST /libraries/:id/upload (multipart, field "file"). A browser form gets a redirect to the
// mapping step; the drop zone (Accept: application/json) gets { location } or { error }.
export async function loader({ request, params }: Route.LoaderArgs) {
  // A GET here (a reload after posting) goes back to the library's page — only a library this workspace may see: 404 else, as there.
  const m = await requireMember(request, "library.read");
  const id = readId(params.id);
  await getLibrary(viewerOf(m), id);
  throw redirect(`/libraries/${id}`);
}

export async function action({ request, params }: Route.ActionArgs) {
  const m = await requireMember(request, "library.write");
  const id = readId(params.id);
  const wantsJson = (request.headers.get("accept") ?? "").includes("application/json");
  let form: FormData;
  try {
    form = await readFormSafe(request);
  } catch {
    return fail("The upload could not be read.", 400);
  }
  const file = form.get("file");
  if (!(file instanceof File)) return fail("Choose a CSV file to upload.", 400);
  try {
    const uploadId = await storeUpload(viewerOf(m), id, file);
    const location = `/libraries/${id}/uploads/${uploadId}`;
    if (wantsJson) return Response.json({ location }, { status: 201 });
    throw redirect(location);
  } catch (e) {
    if (e instanceof UploadRejected) return fail(e.message, 422);
    throw e;
  }

  function fail(error: string, status: number) {
    if (wantsJson) return Response.json({ error }, { status });
    throw data(error, { status });
  }
}
