export * from "./organizations";
export * from "./users";
export * from "./tokens";
export * from "./schedules";
export * from "./outbox";
export * from "./webhooks";
export * from "./api-keys";
export * from "./reviews";
