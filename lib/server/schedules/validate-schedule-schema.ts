import { readFileSync } from "node:fs";
import { join } from "node:path";

import Ajv2020, { type ErrorObject } from "ajv/dist/2020.js";
import addFormats from "ajv-formats";

import type { FieldError } from "@/lib/server/errors";
import { listErrorsBounded, type ValidatorPair } from "@/lib/server/http/bounded-validation";

import { MAX_LISTED_ERRORS } from "./issue-pointers";

/**
 * The public JSON Schema checked in bounded work. The whole document goes through the
 * first-error validator (the fast path for a valid schedule). An invalid one is listed part by
 * part: the envelope without its members, then each member on its own with a compiled member
 * validator, so no ajv run ever holds more than one member's errors. After MAX_LISTED_ERRORS
 * listed problems, the remaining members are only checked and counted, one per invalid member.
 */
interface ScheduleValidators {
  whole: ValidatorPair["firstError"];
  envelope: ValidatorPair;
  member: ValidatorPair;
}

let validators: ScheduleValidators | undefined;

function compileScheduleValidators(): ScheduleValidators {
  const schema = JSON.parse(readFileSync(join(process.cwd(), "api-schemas", "v1", "schedule.schema.json"), "utf8")) as Record<string, unknown> & { $id: string };
  const properties = schema.properties as Record<string, Record<string, unknown>>;
  // The same schema with members reduced to their count limits: the members are checked one by one.
  const { items: _memberItems, ...membersWithoutItems } = properties.members ?? {};
  const envelopeSchema = { ...schema, $id: schema.$id.replace(/\.json$/, ".envelope.json"), properties: { ...properties, members: membersWithoutItems } };
  const build = (allErrors: boolean) => {
    const ajv = new Ajv2020({ allErrors, strict: false, allowUnionTypes: true });
    addFormats(ajv);
    const whole = ajv.compile(schema);
    const member = ajv.compile({ $ref: `${schema.$id}#/$defs/member` });
    const envelope = ajv.compile(envelopeSchema);
    return { whole, member, envelope };
  };
  const quick = build(false);
  const full = build(true);
  return {
    whole: quick.whole,
    envelope: { firstError: quick.envelope, allErrors: full.envelope },
    member: { firstError: quick.member, allErrors: full.member },
  };
}

function describeSchemaError(error: ErrorObject, prefix: string): FieldError {
  const message = error.keyword === "additionalProperties" ? `unknown field "${String(error.params.additionalProperty)}"` : (error.message ?? "is invalid");
  return { pointer: `${prefix}${error.instancePath}`, message };
}

/** Every schema problem, listed up to MAX_LISTED_ERRORS, and their count; null when the document is valid. */
export function findScheduleSchemaErrors(doc: unknown): { listed: FieldError[]; total: number } | null {
  validators ??= compileScheduleValidators();
  if (validators.whole(doc)) return null;
  const listed: FieldError[] = [];
  let total = 0;
  const add = (errors: ErrorObject[] | null, prefix: string) => {
    if (!errors) return;
    for (const error of errors) {
      total += 1;
      if (listed.length < MAX_LISTED_ERRORS) listed.push(describeSchemaError(error, prefix));
    }
  };
  add(listErrorsBounded(validators.envelope, doc), "");
  const members = typeof doc === "object" && doc !== null ? (doc as { members?: unknown }).members : undefined;
  if (Array.isArray(members)) {
    members.forEach((member, index) => {
      if (listed.length < MAX_LISTED_ERRORS) add(listErrorsBounded(validators!.member, member), `/members/${index}`);
      else if (!validators!.member.firstError(member)) total += 1;
    });
  }
  return { listed, total };
}
