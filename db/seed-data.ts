import type { Role } from "./schema";

// An invented scenario: the firms, people and project below do not exist.
export const demoOrganizations = {
  engineering: { id: "org_demoengineering", name: "Brackenridge Halvorsen Structural", kind: "engineering" as const },
  fabricator: { id: "org_demofabricator", name: "Corrow Steel & Timber Works", kind: "fabricator" as const },
};

export const demoProject = {
  id: "prj_demomillrace",
  name: "Millrace Yard, Building 2",
  reference: "BHS-2026-114",
};

export const demoUsers: { role: Role; name: string; email: string; password: string }[] = [
  { role: "admin", name: "Ines Varga", email: "ines.varga@brackenridge.example", password: "admin-demo-Sagline-1" },
  { role: "engineer", name: "Tomasz Achebe", email: "tomasz.achebe@brackenridge.example", password: "engineer-demo-Sagline-1" },
  { role: "integrator", name: "Priya Fennimore", email: "priya.fennimore@corrow.example", password: "integrator-demo-Sagline-1" },
  { role: "submitter", name: "Dara Quillfeather", email: "dara.quillfeather@corrow.example", password: "submitter-demo-Sagline-1" },
  { role: "viewer", name: "Olu Marchetti", email: "olu.marchetti@brackenridge.example", password: "viewer-demo-Sagline-1" },
];

/**
 * A fixed, documented API key for trying the API after `npm start` (README, "API keys"). It is
 * public knowledge: revoke it in Integrations > API keys before any real use.
 */
export const demoApiKey = {
  id: "key_demoengineering",
  name: "Demo key (documented in the README; revoke before real use)",
  secret: "sgl_DemoBrackenridgeTryTheSaglineApi18kU9l",
  scopes: ["schedules:write", "results:read"] as const,
};
