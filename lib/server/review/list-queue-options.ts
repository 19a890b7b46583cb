import { getSql } from "@/db/client";

/** Choices for each filter list; the queue may hold more, which the person can still reach by narrowing elsewhere. */
export const OPTIONS_CAP = 100;

export interface QueueOptions {
  schedules: { id: string; name: string }[];
  projects: { id: string; name: string }[];
  categories: string[];
  governingChecks: string[];
}

/** The values the queue's filter lists offer: those present among the organization's members awaiting review. */
export async function listQueueOptions(organizationId: string): Promise<QueueOptions> {
  const sql = getSql();
  const [schedules, projects, categories, checks] = await Promise.all([
    sql`select s.id, s.name from schedules s where s.organization_id = ${organizationId}
      and exists (select 1 from member_reviews r where r.schedule_id = s.id and r.state = 'awaiting_review')
      order by s.created_at desc limit ${OPTIONS_CAP}`,
    sql`select p.id, p.name from projects p where p.organization_id = ${organizationId}
      and exists (select 1 from member_reviews r where r.organization_id = ${organizationId} and r.project_id = p.id and r.state = 'awaiting_review')
      order by p.name limit ${OPTIONS_CAP}`,
    sql`select distinct category from member_reviews where organization_id = ${organizationId} and state = 'awaiting_review' order by category limit ${OPTIONS_CAP}`,
    sql`select distinct governing_check from member_reviews where organization_id = ${organizationId} and state = 'awaiting_review' and governing_check is not null order by governing_check limit ${OPTIONS_CAP}`,
  ]);
  return {
    schedules: schedules.map((r) => ({ id: r.id as string, name: r.name as string })),
    projects: projects.map((r) => ({ id: r.id as string, name: r.name as string })),
    categories: categories.map((r) => r.category as string),
    governingChecks: checks.map((r) => r.governing_check as string),
  };
}
