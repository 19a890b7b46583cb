export { MAX_MEMBERS, SCHEDULE_FORMAT, getRetiredFormatMessage, parseSchedule } from "./parse-schedule";
export { RETIRED_SCHEDULE_FORMATS } from "./schedule-format";
export type { ParseScheduleOptions, ParseScheduleResult, ParsedSchedule } from "./parse-schedule";
export { MEMBER_CATEGORIES, MAX_SPANS_PER_MEMBER, type MemberOrigins } from "./read-member";
export { MAX_LOADS_PER_MEMBER } from "./read-loads";
export { CASE_NAME_PATTERN } from "./read-profile";
export { parseLimitProfile, type ParseLimitProfileResult } from "./parse-limit-profile";
