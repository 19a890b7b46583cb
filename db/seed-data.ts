import type { Role } from "./schema";

// An invented scenario: the firms, people and project below do not exist.
export const demoOrganizations = {
  engineering: { id: "org_demoengineering", name: "Fernhollow Vantarra Engineers", kind: "engineering" as const },
  fabricator: { id: "org_demofabricator", name: "Ostrovel Steel & Timber Works", kind: "fabricator" as const },
};

export const demoProject = {
  id: "prj_demolumenbrook",
  name: "Lumenbrook Depot, Hall B",
  reference: "BHS-2026-114",
};

/** The invented drawing reference both demo schedule submissions share (db/seed-schedules.ts). */
export const demoScheduleReference = "LBD-HB-S-310";

export const demoUsers: { role: Role; name: string; email: string; password: string }[] = [
  { role: "admin", name: "Ines Varga", email: "ines.varga@fernhollow.example", password: "admin-demo-Sagline-1" },
  { role: "engineer", name: "Tomasz Achebe", email: "tomasz.achebe@fernhollow.example", password: "engineer-demo-Sagline-1" },
  { role: "integrator", name: "Priya Fennimore", email: "priya.fennimore@ostrovel.example", password: "integrator-demo-Sagline-1" },
  { role: "submitter", name: "Dara Quillfeather", email: "dara.quillfeather@ostrovel.example", password: "submitter-demo-Sagline-1" },
  { role: "viewer", name: "Olu Marchetti", email: "olu.marchetti@fernhollow.example", password: "viewer-demo-Sagline-1" },
];

/**
 * A fixed, documented API key for trying the API after `npm start` (README, "API keys"). It is
 * public knowledge: revoke it in Integrations > API keys before any real use.
 */
export const demoApiKey = {
  id: "key_demoengineering",
  name: "Demo key (documented in the README; revoke before real use)",
  secret: "sgl_DemoFernhollowTryTheSaglineApiGo1LDQlZ",
  scopes: ["schedules:write", "results:read"] as const,
};

/**
 * The demo's section catalogue: invented plate girders (examples/catalogue-ostrovel-plate-girders.json),
 * not any manufacturer's table. Its source says so wherever it is shown.
 */
export const demoCatalogue = {
  name: "Ostrovel KPG plate girders (invented)",
  source: "Invented for the Sagline demo (examples/catalogue-ostrovel-plate-girders.json); not a real product table, never use it for design",
  file: "examples/catalogue-ostrovel-plate-girders.json",
};
