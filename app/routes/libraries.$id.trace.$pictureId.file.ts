import type { Route } from "./+types/libraries.$id.trace.$pictureId.file";
import { requireMember } from "~/lib/auth/guards.server";
import { viewerOf } from "~/lib/auth/viewer.server";
import { readId } from "~/lib/shared/forms.server";
import { pictureBytes } from "~/lib/tracer/pictures.server";
import { methodNotAllowed } from "~/lib/shared/problem.server";

// GET /libraries/:id/trace/:pictureId/file — the stored picture, with the type found from its bytes.
export async function loader({ request, params }: Route.LoaderArgs) {
  const m = await requireMember(request, "library.write");
  const { picture, content } = await pictureBytes(viewerOf(m), readId(params.id), readId(params.pictureId));
  const ascii = picture.filename.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  return new Response(new Uint8Array(content), {
    headers: {
      "Content-Type": picture.contentType,
      "Content-Length": String(content.length),
      "Content-Disposition": `inline; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(picture.filename)}`,
      "X-Content-Type-Options": "nosniff",
      "Cache-Control": "private, max-age=3600",
      "Content-Security-Policy": "default-src 'none'; sandbox",
    },
  });
}

export const action = () => methodNotAllowed("GET");
