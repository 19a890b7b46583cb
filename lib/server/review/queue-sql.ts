import type { Fragment, Sql, TransactionSql } from "postgres";

import type { QueueFilter } from "./queue-filters";

type AnySql = Sql | TransactionSql;

/** The WHERE clause of a filtered selection of the queue (alias r = member_reviews), one organization only. */
export function queueWhere(sql: AnySql, organizationId: string, filter: QueueFilter): Fragment {
  return sql`
    r.organization_id = ${organizationId} and r.state = ${filter.state}
    ${filter.scheduleId ? sql`and r.schedule_id = ${filter.scheduleId}` : sql``}
    ${filter.projectId ? sql`and r.project_id = ${filter.projectId}` : sql``}
    ${filter.category ? sql`and r.category = ${filter.category}` : sql``}
    ${filter.governingCheck ? sql`and r.governing_check = ${filter.governingCheck}` : sql``}
    ${filter.utilizationAbove !== undefined ? sql`and r.utilization > ${filter.utilizationAbove}` : sql``}`;
}

// Timestamps leave as text with microseconds: a JavaScript Date keeps milliseconds only, and a
// cursor rounded to them would skip or repeat rows written in the same transaction.
export const timestampKey = (column: string) => `to_char(${column} at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US"Z"')`;
