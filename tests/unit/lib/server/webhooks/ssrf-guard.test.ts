import { describe, expect, it } from "vitest";

import { getBlockedAddressReason, isAllowlisted, parseWebhookUrl, UnsafeUrlError, vetWebhookUrl, type Resolver } from "@/lib/server/webhooks/ssrf-guard";

// A resolver standing in for DNS: names map to the addresses an attacker could make them answer.
const fakeDns: Record<string, string[]> = {
  "partner.example": ["93.184.215.14"],
  "rebind-loopback.example": ["127.0.0.1"],
  "private-ten.example": ["10.1.2.3"],
  "mixed.example": ["93.184.215.14", "192.168.1.20"],
  "metadata-alias.example": ["169.254.169.254"],
  "v6-ula.example": ["fd00:ec2::254"],
  "v6-mapped.example": ["::ffff:10.0.0.1"],
  "v6-public.example": ["2606:4700:4700::1111"],
  "cgnat.example": ["100.64.0.1"],
  "teredo.example": ["2001::1"],
};
const resolve: Resolver = async (hostname) => {
  const answer = fakeDns[hostname];
  if (!answer) throw new Error("ENOTFOUND");
  return answer;
};

async function refusal(url: string, allowlist: string[] = []): Promise<string> {
  try {
    await vetWebhookUrl(url, { allowlist, resolve });
  } catch (e) {
    expect(e).toBeInstanceOf(UnsafeUrlError);
    return (e as Error).message;
  }
  throw new Error(`${url} was let through`);
}

describe("the SSRF guard refuses non-public targets", () => {
  // Address ranges: IANA IPv4 and IPv6 Special-Purpose Address Registries (RFC 6890, RFC 6598 CGNAT,
  // RFC 4193 unique local, RFC 4291 link-local and IPv4-mapped).
  it.each([
    ["loopback", "http://127.0.0.1/hook"],
    ["loopback elsewhere in 127/8", "http://127.45.6.7/"],
    ["this-network 0.0.0.0", "http://0.0.0.0/"],
    ["the short zero form", "http://0/"],
    ["10/8", "https://10.0.0.5/"],
    ["172.16/12 low end", "https://172.16.0.1/"],
    ["172.16/12 high end", "https://172.31.255.254/"],
    ["192.168/16", "https://192.168.0.10/"],
    ["100.64/10 CGNAT", "https://100.100.1.1/"],
    ["169.254/16 link-local", "http://169.254.10.10/"],
    ["the metadata address", "http://169.254.169.254/latest/meta-data/"],
    ["multicast", "http://224.0.0.1/"],
    ["broadcast", "http://255.255.255.255/"],
    ["IPv6 loopback", "http://[::1]/"],
    ["IPv6 unspecified", "http://[::]/"],
    ["IPv6 unique local fc00::/7", "http://[fc00::1]/"],
    ["the IPv6 metadata address", "http://[fd00:ec2::254]/"],
    ["IPv6 link-local", "http://[fe80::1]/"],
    ["IPv6 multicast", "http://[ff02::1]/"],
    ["IPv4-mapped IPv6 loopback", "http://[::ffff:127.0.0.1]/"],
    ["IPv4-mapped IPv6 of a public address", "http://[::ffff:8.8.8.8]/"],
    ["IPv4-mapped IPv6 written in hex (::ffff:0:0/96)", "http://[::ffff:7f00:1]/"],
    ["NAT64 64:ff9b::/96 of a private address", "http://[64:ff9b::a00:1]/"],
    ["NAT64 64:ff9b::/96 of the metadata address", "http://[64:ff9b::169.254.169.254]/"],
    ["discard-only 100::/64", "http://[100::1]/"],
    ["Teredo 2001::/32", "http://[2001:0:4136:e378:8000:63bf:3fff:fdd2]/"],
    ["decimal integer loopback", "http://2130706433/"],
    ["hex short form", "http://0x7f.1/"],
    ["hex integer", "http://0x7f000001/"],
    ["octal integer", "http://017700000001/"],
    ["octal dotted", "http://0177.0.0.1/"],
    ["short dotted 127.1", "http://127.1/"],
    ["decimal integer of 169.254.169.254", "http://2852039166/"],
    ["localhost", "http://localhost:3000/"],
    ["LOCALHOST with a trailing dot", "http://LOCALHOST./"],
    ["a subdomain of localhost", "http://api.localhost/"],
    ["metadata.google.internal", "http://metadata.google.internal/computeMetadata/v1/"],
  ])("refuses %s (%s)", async (_label, url) => {
    expect(await refusal(url)).toMatch(/non-public/);
  });

  it.each([
    ["rebind-loopback.example", "127.0.0.1"],
    ["private-ten.example", "10.1.2.3"],
    ["mixed.example", "192.168.1.20"],
    ["metadata-alias.example", "169.254.169.254"],
    ["v6-ula.example", "fd00:ec2::254"],
    ["v6-mapped.example", "::ffff:10.0.0.1"],
    ["cgnat.example", "100.64.0.1"],
    ["teredo.example", "2001::1"],
  ])("refuses a name resolving to a non-public address (%s)", async (name, address) => {
    const message = await refusal(`https://${name}/hook`);
    expect(message).toContain(`resolves to a non-public address`);
    expect(message).toContain(address);
  });

  it.each([
    ["ftp", "ftp://partner.example/"],
    ["file", "file:///etc/passwd"],
    ["javascript", "javascript:alert(1)"],
    ["gopher", "gopher://partner.example/"],
  ])("refuses the %s scheme", async (_label, url) => {
    expect(await refusal(url)).toMatch(/must start with https:\/\/ or http:\/\//);
  });

  it("refuses credentials in the URL, garbage and unresolvable names", async () => {
    expect(await refusal("https://user:pw@partner.example/")).toMatch(/user name or password/);
    expect(await refusal("not a url")).toMatch(/not a valid URL/);
    expect(await refusal("http://999999999999/")).toMatch(/not a valid URL/);
    expect(await refusal("https://nowhere.example/")).toMatch(/could not be resolved/);
  });
});

describe("the SSRF guard lets public targets through and pins the address", () => {
  it("vets a public name and returns its address to connect to", async () => {
    const target = await vetWebhookUrl("https://partner.example/hooks/sagline", { allowlist: [], resolve });
    expect(target).toMatchObject({ address: "93.184.215.14", family: 4, allowlisted: false });
    expect(target.url.pathname).toBe("/hooks/sagline");
  });

  it("accepts public IPv4 and IPv6 literals and names", async () => {
    expect((await vetWebhookUrl("http://93.184.215.14/", { allowlist: [], resolve })).address).toBe("93.184.215.14");
    expect((await vetWebhookUrl("https://v6-public.example/", { allowlist: [], resolve })).family).toBe(6);
    expect(getBlockedAddressReason("8.8.8.8")).toBeNull();
    expect(getBlockedAddressReason("2606:4700:4700::1111")).toBeNull();
  });

  it("lets an allowlisted loopback host and host:port through, and nothing else on loopback", async () => {
    const allowlist = ["127.0.0.1:3795", "localhost"];
    expect((await vetWebhookUrl("http://127.0.0.1:3795/hooks/a", { allowlist, resolve: async () => ["127.0.0.1"] })).allowlisted).toBe(true);
    expect((await vetWebhookUrl("http://localhost/", { allowlist, resolve: async () => ["127.0.0.1"] })).address).toBe("127.0.0.1");
    // A bare host in the allowlist does not open other ports: only host:port does.
    expect(await refusal("http://localhost:4000/", allowlist)).toMatch(/port 4000/);
    expect(await refusal("http://127.0.0.1:3796/", allowlist)).toMatch(/non-public/);
    expect(isAllowlisted(new URL("http://127.0.0.1/"), ["127.0.0.1:80"])).toBe(true);
    expect(isAllowlisted(new URL("https://127.0.0.1/"), ["127.0.0.1:80"])).toBe(false);
  });

  it("refuses ports other than 80 and 443 unless the allowlist names host:port", async () => {
    expect(await refusal("https://partner.example:8443/")).toMatch(/port 8443.*partner\.example:8443/);
    expect(await refusal("http://93.184.215.14:22/")).toMatch(/port 22/);
    expect((await vetWebhookUrl("https://partner.example:443/", { allowlist: [], resolve })).address).toBe("93.184.215.14");
    expect((await vetWebhookUrl("https://partner.example:8443/", { allowlist: ["partner.example:8443"], resolve })).url.port).toBe("8443");
  });

  it("refuses a name whose lookup does not answer in time", async () => {
    const never: Resolver = () => new Promise(() => undefined);
    await expect(vetWebhookUrl("https://slow.example/", { allowlist: [], resolve: never, dnsTimeoutMs: 50 })).rejects.toThrow(/did not resolve within 50 ms/);
  });

  it("normalises encoded hosts before checking, so the parse and the connection agree", () => {
    expect(() => parseWebhookUrl("http://0x7f.1/", [])).toThrow(UnsafeUrlError);
    expect(parseWebhookUrl("HTTPS://Partner.Example/x", []).hostname).toBe("partner.example");
  });
});
