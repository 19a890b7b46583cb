import { DomainError } from "@/lib/server/errors";

/** Reads a request body, refusing with 413 as soon as it passes maxBytes (never buffers more). */
export async function readBodyBytes(request: Request, maxBytes: number): Promise<Uint8Array> {
  const declared = Number(request.headers.get("content-length") ?? "0");
  const tooLarge = () => new DomainError("too_large", `The body is larger than the limit of ${maxBytes} bytes.`, [], undefined, { limitBytes: maxBytes });
  if (declared > maxBytes) throw tooLarge();
  if (!request.body) return new Uint8Array();
  // A declared length is read straight into its buffer: the body is held once, never twice.
  const chunks: Uint8Array[] = [];
  let out = declared > 0 && Number.isInteger(declared) ? new Uint8Array(declared) : null;
  let total = 0;
  const reader = request.body.getReader();
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    if (total + value.byteLength > maxBytes) {
      await reader.cancel();
      throw tooLarge();
    }
    if (out && total + value.byteLength <= out.length) out.set(value, total);
    else {
      // more than declared (or nothing declared): collect and join at the end
      if (out) chunks.push(out.subarray(0, total));
      out = null;
      chunks.push(value);
    }
    total += value.byteLength;
  }
  if (out) return total === out.length ? out : out.subarray(0, total);
  const joined = new Uint8Array(total);
  let offset = 0;
  for (const chunk of chunks) {
    joined.set(chunk, offset);
    offset += chunk.byteLength;
  }
  return joined;
}

export function decodeUtf8(bytes: Uint8Array, what: string): string {
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw new DomainError("bad_request", `The ${what} is not valid UTF-8 text. Save it as UTF-8 (CSV UTF-8 in spreadsheet programs).`);
  }
}
