// Download one attachment, for members of the team that owns its option only (else 404).
import type { Route } from "./+types/attachments.$attachmentId";
import { requirePermission } from "~/lib/auth.server";
import { idParam } from "~/lib/route-params";
import { readAttachment } from "~/lib/attachments.server";

/** Content-Disposition for any name: an ASCII fallback and the exact name in RFC 5987 form. */
function disposition(name: string): string {
  const ascii = name.replace(/[^\x20-\x7e]|["\\%;]/g, "_");
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(name)}`;
}

export async function loader({ request, params }: Route.LoaderArgs) {
  const user = await requirePermission(request, "read");
  const { row, bytes } = await readAttachment(user.teamId, idParam(params.attachmentId));
  return new Response(new Uint8Array(bytes), {
    headers: {
      "Content-Type": row.contentType,
      "Content-Length": String(bytes.byteLength),
      "Content-Disposition": disposition(row.fileName),
      "Cache-Control": "no-store",
      // never rendered as a page of ours, whatever a browser makes of the bytes
      "Content-Security-Policy": "sandbox; default-src 'none'",
      "X-Content-Type-Options": "nosniff",
    },
  });
}
