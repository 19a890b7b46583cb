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
