import { headers } from "next/headers";

import { getEnv } from "@/lib/env";

import { readClientAddress } from "./client-address";

/** The client address of the request a server action or page is handling (see readClientAddress). */
export async function getRequestAddress(): Promise<string> {
  return readClientAddress(await headers(), getEnv().TRUSTED_PROXY_COUNT);
}
