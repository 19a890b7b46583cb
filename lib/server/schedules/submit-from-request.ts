import { DomainError } from "@/lib/server/errors";
import { hashRequest, runIdempotent, type StoredResponse } from "@/lib/server/http/idempotency";
import { readBodyBytes } from "@/lib/server/http/read-body";

import { readCsvParameters, readScheduleCsv, readScheduleJson } from "./read-schedule-body";
import { MAX_SCHEDULE_BODY_BYTES, withIntakePermit } from "./intake-gate";
import { scheduleLinks } from "./represent";
import { submitSchedule, type SubmitScheduleInput, type SubmittedSchedule } from "./submit-schedule";

export { MAX_SCHEDULE_BODY_BYTES };

type Submitter = Pick<SubmitScheduleInput, "organizationId" | "apiKeyId" | "submittedByUserId">;

async function buildSubmission(fullType: string, type: string, bytes: Uint8Array, params: URLSearchParams): Promise<Pick<SubmitScheduleInput, "doc" | "source" | "toFieldErrors">> {
  if (type === "application/json") {
    return { doc: readScheduleJson(bytes, "body"), source: "api-json" };
  }
  if (type === "text/csv") {
    const csv = await readScheduleCsv(bytes, readCsvParameters((n) => params.get(n), "CSV schedule"));
    return { ...csv, source: "api-csv" };
  }
  if (type === "multipart/form-data") return buildFromMultipart(bytes, params, fullType);
  throw new DomainError("unsupported_media_type", "Send application/json, text/csv or multipart/form-data with a file part.");
}

async function buildFromMultipart(bytes: Uint8Array, params: URLSearchParams, contentType: string) {
  let form: FormData;
  try {
    form = await new Response(new Blob([bytes as BlobPart]), { headers: { "content-type": contentType } }).formData();
  } catch {
    throw new DomainError("bad_request", "The multipart body could not be read.");
  }
  const file = form.get("file");
  if (!(file instanceof Blob)) throw new DomainError("bad_request", 'The multipart body needs a "file" part.', [{ pointer: "/file", message: "missing" }]);
  const fileBytes = new Uint8Array(await file.arrayBuffer());
  const fileName = file instanceof File ? file.name : "schedule";
  const get = (name: string) => {
    const v = form.get(name);
    return typeof v === "string" ? v : params.get(name);
  };
  if (file.type === "application/json" || fileName.toLowerCase().endsWith(".json")) {
    return { doc: readScheduleJson(fileBytes, "file"), source: "api-json" as const };
  }
  const csv = await readScheduleCsv(fileBytes, readCsvParameters(get, fileName.replace(/\.[^.]+$/, "")));
  return { ...csv, source: "api-csv" as const };
}

/**
 * POST /api/v1/schedules behind the API-key check: reads the body (JSON, CSV or multipart),
 * validates all of it, stores and queues it, under the Idempotency-Key rules and an intake permit
 * (503 with Retry-After when the process is already reading as many as its memory budget allows).
 */
export async function submitScheduleRequest(request: Request, submitter: Submitter): Promise<StoredResponse & { replayed: boolean }> {
  return withIntakePermit(request, () => readAndSubmit(request, submitter));
}

async function readAndSubmit(request: Request, submitter: Submitter): Promise<StoredResponse & { replayed: boolean }> {
  const url = new URL(request.url);
  const fullType = request.headers.get("content-type") ?? "";
  const type = fullType.split(";")[0]!.trim().toLowerCase();
  const bytes = await readBodyBytes(request, MAX_SCHEDULE_BODY_BYTES);
  const hashThisRequest = () => hashRequest([type, url.searchParams.toString(), bytes]);
  const toResponse = (created: SubmittedSchedule): StoredResponse => ({ status: 202, body: { ...created, links: scheduleLinks(created.id) } });
  return runIdempotent(submitter.organizationId, request.headers.get("idempotency-key"), hashThisRequest, async (completeKey) => {
    const submission = await buildSubmission(fullType, type, bytes, url.searchParams);
    const created = await submitSchedule({
      ...submitter,
      ...submission,
      callbackEndpointId: url.searchParams.get("callbackEndpointId"),
      // The key's answer commits with the schedule: a retry replays it or finds no schedule.
      inTransaction: (tx, stored) => completeKey(tx, toResponse(stored)),
    });
    return toResponse(created);
  });
}
