import { DomainError } from "@/lib/server/errors";

/** Reads a request body, refusing with 413 as soon as it passes maxBytes (never buffers more). */
export async function readBodyBytes(request: Request, maxBytes: number): Promise<Uint8Array> {
  const declared = Number(request.headers.get("content-length") ?? "0");
  const tooLarge = () => new DomainError("too_large", `The body is larger than the limit of ${maxBytes} bytes.`, [], undefined, { limitBytes: maxBytes });
  if (declared > maxBytes) throw tooLarge();
  if (!request.body) return new Uint8Array();
  const chunks: Uint8Array[] = [];
  let total = 0;
  const reader = request.body.getReader();
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel();
      throw tooLarge();
    }
    chunks.push(value);
  }
  const out = new Uint8Array(total);
  let offset = 0;
  for (const chunk of chunks) {
    out.set(chunk, offset);
    offset += chunk.byteLength;
  }
  return out;
}

export function decodeUtf8(bytes: Uint8Array, what: string): string {
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw new DomainError("bad_request", `The ${what} is not valid UTF-8 text. Save it as UTF-8 (CSV UTF-8 in spreadsheet programs).`);
  }
}
