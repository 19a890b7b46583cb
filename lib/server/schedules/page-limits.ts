// Page sizes of the schedule list and results endpoints; the OpenAPI document states the same.

/** GET /api/v1/schedules: largest and default `limit`. */
export const SCHEDULE_PAGE_MAX = 100;
export const SCHEDULE_PAGE_DEFAULT = 20;

/** GET /api/v1/schedules/{scheduleId}/results as JSON: largest and default `limit`. */
export const RESULT_PAGE_MAX = 1000;
export const RESULT_PAGE_DEFAULT = 100;
