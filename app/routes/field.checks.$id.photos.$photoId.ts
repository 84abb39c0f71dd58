import type { Route } from "./+types/field.checks.$id.photos.$photoId";
import { requireMember } from "~/lib/auth/guards.server";
import { viewerOf } from "~/lib/auth/viewer.server";
import { readId } from "~/lib/shared/forms.server";
import { getPhoto } from "~/lib/fieldchecks/photos.server";
import { methodNotAllowed } from "~/lib/shared/problem.server";

// GET /field/checks/:id/photos/:photoId — one photo, with the content type found from its bytes at upload.
export async function loader({ request, params }: Route.LoaderArgs) {
  const m = await requireMember(request, "fieldcheck.read");
  const p = await getPhoto(viewerOf(m), readId(params.id), readId(params.photoId));
  const ascii = p.filename.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  return new Response(new Uint8Array(p.content), {
    headers: {
      "Content-Type": p.contentType,
      "Content-Length": String(p.content.length),
      "Content-Disposition": `inline; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(p.filename)}`,
      "X-Content-Type-Options": "nosniff",
      "Cache-Control": "private, max-age=3600",
      "Content-Security-Policy": "default-src 'none'; sandbox",
    },
  });
}

export const action = () => methodNotAllowed("GET");
