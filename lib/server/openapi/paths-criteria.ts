import { jsonResponse, pathParameter, problemResponse, queryParameter, type Operation } from "./operations";

const body = (component: string) => ({ required: true, content: { "application/json": { schema: { $ref: `#/components/schemas/${component}` } } } });
const removed = (what: string) => ({ "204": { description: `Removed. ${what}` } });

const profileId = pathParameter("profileId", "The profile's id (`lp_...`).");
const materialId = pathParameter("materialId", "The material's id (`mat_...`).");
const catalogueId = pathParameter("catalogueId", "The catalogue's id (`cat_...`).");
const noProfile = problemResponse("No such limit profile in this organization.");
const noMaterial = problemResponse("No such material in this organization.");
const noCatalogue = problemResponse("No such section catalogue in this organization.");

const profileOperations = {
  "GET /api/v1/limit-profiles": {
    operationId: "listLimitProfiles",
    tags: ["Criteria"],
    summary: "List limit profiles",
    description: 'The organization\'s own limit profiles. A schedule names one as `profile: {"id": "lp_..."}` (CSV: `profile=lp_...`) and records the version it was checked against.',
    responses: { "200": jsonResponse("Each profile at its current version.", "LimitProfileList") },
  },
  "POST /api/v1/limit-profiles": {
    operationId: "createLimitProfile",
    tags: ["Criteria"],
    summary: "Create a limit profile",
    description: "From a preset to copy (`basedOnPreset`) or a definition in the schedule's `limits.custom` format. Version 1.",
    requestBody: body("LimitProfileWrite"),
    responses: { "201": jsonResponse("Created.", "LimitProfile"), "409": problemResponse("The organization holds the most profiles it may."), "422": problemResponse("Invalid body; each problem has the pointer of its field, e.g. /definition/combinations/0/limitRatio.") },
  },
  "GET /api/v1/limit-profiles/[profileId]": {
    operationId: "getLimitProfile",
    tags: ["Criteria"],
    summary: "Read a limit profile with its versions",
    parameters: [profileId],
    responses: { "200": jsonResponse("The profile and every version, newest first.", "LimitProfile"), "404": noProfile },
  },
  "PUT /api/v1/limit-profiles/[profileId]": {
    operationId: "updateLimitProfile",
    tags: ["Criteria"],
    summary: "Change a limit profile (a new version)",
    description: "Saves a new version. Schedules already checked keep their results and the version they were checked against; the schedule page offers to recheck them with the new version.",
    parameters: [profileId],
    requestBody: body("LimitProfileWrite"),
    responses: { "200": jsonResponse("The profile at its new version.", "LimitProfile"), "404": noProfile, "409": problemResponse("expectedVersion is not the current version."), "422": problemResponse("Invalid body.") },
  },
  "DELETE /api/v1/limit-profiles/[profileId]": {
    operationId: "deleteLimitProfile",
    tags: ["Criteria"],
    summary: "Remove a limit profile",
    parameters: [profileId],
    responses: { ...removed("Schedules checked against it keep the profile stored with them."), "404": noProfile },
  },
} satisfies Record<string, Operation>;

const materialOperations = {
  "GET /api/v1/materials": {
    operationId: "listMaterials",
    tags: ["Criteria"],
    summary: "List organization materials",
    description: "A member names one by id (`material: \"mat_...\"`, or the CSV material column) beside the library ids.",
    responses: { "200": jsonResponse("The organization's materials.", "MaterialList") },
  },
  "POST /api/v1/materials": {
    operationId: "createMaterial",
    tags: ["Criteria"],
    summary: "Add a material",
    requestBody: body("MaterialWrite"),
    responses: { "201": jsonResponse("Added.", "Material"), "409": problemResponse("A material of that name exists, or the organization holds the most it may."), "422": problemResponse("Invalid body.") },
  },
  "GET /api/v1/materials/[materialId]": {
    operationId: "getMaterial",
    tags: ["Criteria"],
    summary: "Read a material",
    parameters: [materialId],
    responses: { "200": jsonResponse("The material.", "Material"), "404": noMaterial },
  },
  "PUT /api/v1/materials/[materialId]": {
    operationId: "updateMaterial",
    tags: ["Criteria"],
    summary: "Change a material",
    description: "For schedules submitted from now on: a schedule stores the material values it was checked with.",
    parameters: [materialId],
    requestBody: body("MaterialWrite"),
    responses: { "200": jsonResponse("The changed material.", "Material"), "404": noMaterial, "409": problemResponse("A material of that name exists."), "422": problemResponse("Invalid body.") },
  },
  "DELETE /api/v1/materials/[materialId]": {
    operationId: "deleteMaterial",
    tags: ["Criteria"],
    summary: "Remove a material",
    parameters: [materialId],
    responses: { ...removed("Schedules already submitted keep the values they were checked with."), "404": noMaterial },
  },
} satisfies Record<string, Operation>;

const catalogueOperations = {
  "GET /api/v1/section-catalogues": {
    operationId: "listSectionCatalogues",
    tags: ["Criteria"],
    summary: "List section catalogues",
    description: "Catalogues in use resolve section names in schedules (case and spaces ignored) and give each failing member the lightest passing section (by mass per metre).",
    responses: { "200": jsonResponse("The catalogues, without their sections.", "SectionCatalogueList") },
  },
  "POST /api/v1/section-catalogues": {
    operationId: "importSectionCatalogue",
    tags: ["Criteria"],
    summary: "Import a section catalogue (JSON or CSV)",
    description:
      "JSON: the SectionCatalogueUpload body. CSV (`text/csv`): a header naming the columns name, iMm4, areaMm2, massKgPerM and optionally shearAreaMm2 (internal units: mm^4, mm^2, kg/m), one section per row, with the query parameters below. Every row is checked; any problem refuses the whole file and lists each with its row (header = 1 in CSV; position from 1 in JSON), column or pointer, and reason, at most 1,000 listed (`errorCount` has the total). At most 2,000 sections and 2 MB.",
    parameters: [
      queryParameter("name", "CSV only: the catalogue's name, unique in the organization (case ignored).", { type: "string", maxLength: 100 }),
      queryParameter("source", "CSV only: where the properties come from.", { type: "string", maxLength: 500 }),
      queryParameter("inUse", "CSV only: put it in use at once (default true).", { type: "boolean" }),
    ],
    requestBody: {
      required: true,
      content: { "application/json": { schema: { $ref: "#/components/schemas/SectionCatalogueUpload" } }, "text/csv": { schema: { type: "string" } } },
    },
    responses: {
      "201": jsonResponse("Imported.", "SectionCatalogue"),
      "409": problemResponse("A catalogue of that name exists, or the catalogues in use would hold more than 5,000 sections."),
      "413": problemResponse("Over 2 MB."),
      "415": problemResponse("Neither application/json nor text/csv."),
      "422": problemResponse("Row problems: each names its row and column (CSV) or pointer (JSON)."),
    },
  },
  "GET /api/v1/section-catalogues/[catalogueId]": {
    operationId: "getSectionCatalogue",
    tags: ["Criteria"],
    summary: "Read a section catalogue with its sections",
    parameters: [catalogueId],
    responses: { "200": jsonResponse("The catalogue and its sections in file order.", "SectionCatalogue"), "404": noCatalogue },
  },
  "PATCH /api/v1/section-catalogues/[catalogueId]": {
    operationId: "updateSectionCatalogue",
    tags: ["Criteria"],
    summary: "Put a catalogue in or out of use",
    parameters: [catalogueId],
    requestBody: body("SectionCatalogueUpdate"),
    responses: { "200": jsonResponse("The catalogue.", "SectionCatalogue"), "404": noCatalogue, "409": problemResponse("The catalogues in use would hold more than 5,000 sections.") },
  },
  "DELETE /api/v1/section-catalogues/[catalogueId]": {
    operationId: "deleteSectionCatalogue",
    tags: ["Criteria"],
    summary: "Remove a section catalogue",
    parameters: [catalogueId],
    responses: { ...removed("Schedules already submitted keep the sections they were checked with."), "404": noCatalogue },
  },
} satisfies Record<string, Operation>;

const recheckOperations = {
  "POST /api/v1/schedules/[scheduleId]/recheck": {
    operationId: "recheckSchedule",
    tags: ["Criteria"],
    summary: "Recheck a schedule with its profile's new version",
    description:
      "For a schedule checked against an organization limit profile that has a newer version since: submits the same members again, against the current version, as a new schedule linked to this one (`recheckOf`). The old schedule and its results never change.",
    parameters: [pathParameter("scheduleId", "The schedule's id (`sch_...`).")],
    responses: {
      "202": jsonResponse("The new schedule, queued.", "ScheduleAccepted"),
      "404": problemResponse("No such schedule in this organization."),
      "409": problemResponse("Not checked against an organization profile, the profile was removed, or it was checked against the current version already."),
    },
  },
} satisfies Record<string, Operation>;

/** The organization's engineering criteria: limit profiles, materials, section catalogues, and the recheck. */
export const criteriaOperations = { ...profileOperations, ...materialOperations, ...catalogueOperations, ...recheckOperations };
