import { importCatalogueCsv, importCatalogueJson, MAX_CATALOGUE_FILE_BYTES } from "@/lib/server/criteria/import-catalogue-file";
import { listSectionCatalogues } from "@/lib/server/criteria/section-catalogues";
import { DomainError, type FieldError } from "@/lib/server/errors";

import { noStore, validateCatalogueUpload } from "../_lib/criteria-bodies";
import { assertContentType, assertValid, parseJsonText, readBodyText } from "../_lib/validate-body";
import { withApiKey } from "../_lib/with-api-key";

export const dynamic = "force-dynamic";

/** CSV uploads name the catalogue in the query: name, source and inUse (default true). */
function readCsvQuery(url: URL) {
  const errors: FieldError[] = [];
  const name = url.searchParams.get("name")?.trim() ?? "";
  const source = url.searchParams.get("source")?.trim() ?? "";
  const inUseText = url.searchParams.get("inUse") ?? "true";
  if (name === "" || name.length > 100) errors.push({ pointer: "/query/name", message: "must be 1 to 100 characters" });
  if (source === "" || source.length > 500) errors.push({ pointer: "/query/source", message: "must be 1 to 500 characters: where the properties come from" });
  if (inUseText !== "true" && inUseText !== "false") errors.push({ pointer: "/query/inUse", message: 'must be "true" or "false"' });
  if (errors.length > 0) throw new DomainError("bad_request", "Some query parameters are missing or wrong.", errors);
  return { name, source, inUse: inUseText === "true" };
}

// GET /api/v1/section-catalogues: the organization's catalogues, without their sections.
export const GET = withApiKey("results:read", async (_request, key) => {
  return Response.json({ data: await listSectionCatalogues(key.organizationId) }, { headers: noStore });
});

// POST /api/v1/section-catalogues: imports a catalogue from JSON or CSV; any row problem refuses the whole file.
export const POST = withApiKey("criteria:manage", async (request, key) => {
  const type = assertContentType(request, ["application/json", "text/csv"]);
  const text = await readBodyText(request, MAX_CATALOGUE_FILE_BYTES);
  const catalogue =
    type === "text/csv"
      ? await importCatalogueCsv({ organizationId: key.organizationId, ...readCsvQuery(new URL(request.url)) }, text)
      : await (async () => {
          const body = assertValid(validateCatalogueUpload, parseJsonText(text));
          return importCatalogueJson({ organizationId: key.organizationId, name: body.name, source: body.source, inUse: body.inUse ?? true }, body.sections, "/sections");
        })();
  return Response.json(catalogue, { status: 201, headers: { ...noStore, location: `/api/v1/section-catalogues/${catalogue.id}` } });
});
