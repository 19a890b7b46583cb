// /api-docs is rendered from the OpenAPI document: every operation the document lists appears with
// its curl line, its request and response schemas, and the caution. Generic over the document, so
// an endpoint added to the document is held to the same rule without changing this test.
import request from "supertest";
import { describe, expect, it } from "vitest";

import { APP_URL } from "@/tests/helpers/app";

function decode(html: string): string {
  return html.replaceAll("&quot;", '"').replaceAll("&#x27;", "'").replaceAll("&amp;", "&").replaceAll("&lt;", "<").replaceAll("&gt;", ">").replaceAll("<!-- -->", "");
}

describe("/api-docs", () => {
  it("shows every operation of the OpenAPI document with a curl line, its schemas and the caution, loading nothing from elsewhere", async () => {
    const document = (await request(APP_URL).get("/api/v1/openapi.json")).body as { paths: Record<string, Record<string, { "x-sagline-scope"?: string }>> };
    const page = await request(APP_URL).get("/api-docs");
    expect(page.status).toBe(200);
    const html = decode(page.text);
    expect(html).toMatch(/engineer of record/i);
    const operations = Object.entries(document.paths).flatMap(([path, methods]) => Object.entries(methods).map(([method, op]) => ({ method: method.toUpperCase(), path, scope: op["x-sagline-scope"] })));
    expect(operations.length).toBeGreaterThan(10);
    for (const { method, path, scope } of operations) {
      const label = `${method} ${path}`;
      expect(html, label).toContain(`aria-label="curl example for ${label}"`);
      const curl = new RegExp(`curl -sS${method === "GET" ? "" : ` -X ${method}`} "[^"]*${path.replace(/\{[^}]+\}/g, "[^/\"]+").replaceAll(".", "\\.")}"`);
      expect(html, label).toMatch(curl);
      const block = html.slice(html.indexOf(`aria-label="curl example for ${label}"`)).split("</pre>")[0]!;
      if (scope === "public" || scope === "signed-link") expect(block, label).not.toContain("Bearer $KEY");
      else expect(block, label).toContain('-H "authorization: Bearer $KEY"');
    }
    // the submit example is the invented example schedule, runnable as shown
    expect(html).toContain('"format":"sagline.schedule/v2"');
    // no script, style or font is fetched from another origin
    const external = [...page.text.matchAll(/<(?:script|img|link|iframe)\b[^>]*\b(?:src|href)="(https?:\/\/[^"]+)"/g)].map((m) => m[1]!).filter((url) => !url.startsWith(APP_URL));
    expect(external).toEqual([]);
  });
});
