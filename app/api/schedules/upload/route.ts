import { DomainError } from "@/lib/server/errors";
import { readBodyBytes } from "@/lib/server/http/read-body";
import { withSessionRoute } from "@/lib/server/auth/guards";
import { readCsvParameters, readScheduleCsv } from "@/lib/server/schedules/read-schedule-body";
import { MAX_SCHEDULE_BODY_BYTES, withIntakePermit } from "@/lib/server/schedules/intake-gate";
import { submitSchedule } from "@/lib/server/schedules/submit-schedule";

async function readMultipart(request: Request): Promise<FormData> {
  const contentType = request.headers.get("content-type") ?? "";
  if (!contentType.toLowerCase().startsWith("multipart/form-data")) {
    throw new DomainError("unsupported_media_type", 'Send multipart/form-data with a "file" part and the CSV parameters.');
  }
  // Read with the size cap first: request.formData() would buffer any size.
  const bytes = await readBodyBytes(request, MAX_SCHEDULE_BODY_BYTES);
  try {
    return await new Response(bytes as Uint8Array<ArrayBuffer>, { headers: { "content-type": contentType } }).formData();
  } catch {
    throw new DomainError("bad_request", "The multipart body could not be read.");
  }
}

// POST /api/schedules/upload: a CSV schedule from the dashboard (cookie session); 202 with its id, 422 with every row error.
export const POST = withSessionRoute("POST /api/schedules/upload", (request, context) => withIntakePermit(request, () => uploadSchedule(request, context)));

async function uploadSchedule(request: Request, context: Parameters<Parameters<typeof withSessionRoute>[1]>[1]) {
  const form = await readMultipart(request);
  const file = form.get("file");
  if (!(file instanceof Blob)) throw new DomainError("bad_request", 'The upload needs a "file" part.', [{ pointer: "/file", message: "missing" }]);
  const bytes = new Uint8Array(await file.arrayBuffer());
  const fileName = file instanceof File && file.name ? file.name : "CSV schedule";
  const get = (name: string) => {
    const value = form.get(name);
    return typeof value === "string" && value !== "" ? value : null;
  };
  const csv = await readScheduleCsv(bytes, readCsvParameters(get, fileName.replace(/\.[^.]+$/, "")));
  const created = await submitSchedule({
    organizationId: context!.active!.organizationId,
    source: "upload",
    submittedByUserId: context!.user.id,
    doc: csv.doc,
    toFieldErrors: csv.toFieldErrors,
  });
  return Response.json({ ...created, links: { self: `/schedules/${created.id}`, progress: `/api/schedules/${created.id}/progress` } }, { status: 202 });
}
