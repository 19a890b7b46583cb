/** The public schedule format's identifier; a change in the meaning of anything a partner sends gets a new one (CHANGELOG.md). */
export const SCHEDULE_FORMAT = "sagline.schedule/v2";

/** Formats no longer read, with what changed, so a sender learns how to move on. */
export const RETIRED_SCHEDULE_FORMATS: Readonly<Record<string, string>> = {
  "sagline.schedule/v1":
    'sagline.schedule/v1 is retired; send "format": "sagline.schedule/v2". What changed: the top-level "limits" block is now "profile"; a hollow_rectangle section is {"b", "h", "t"} with b and h its OUTER width and depth (v1 read b and h as the inner size beside B and H). See CHANGELOG.md.',
};
