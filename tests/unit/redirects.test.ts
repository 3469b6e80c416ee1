// The one redirect rule (app/lib/redirects.ts): only paths on this site, never off-site, never throws.
import { describe, expect, it } from "vitest";
import { safeRedirectPath } from "../../app/lib/redirects.ts";

const FALLBACK = "/studio";

describe("safeRedirectPath", () => {
  it("keeps paths on this site, with query and fragment, dot segments applied", () => {
    expect(safeRedirectPath("/studio/team", FALLBACK)).toBe("/studio/team");
    expect(safeRedirectPath("/editions/ics-2024-12?view=chart#Jurassic", FALLBACK)).toBe("/editions/ics-2024-12?view=chart#Jurassic");
    expect(safeRedirectPath("/studio/exhibits/../library", FALLBACK)).toBe("/studio/library");
    expect(safeRedirectPath("/studio/exhibits/caf%C3%A9-walk", FALLBACK)).toBe("/studio/exhibits/caf%C3%A9-walk");
  });

  it("gives the fallback for other hosts, schemes, control and non-ASCII characters, backslashes and non-strings", () => {
    const refused: unknown[] = [
      "/\t/evil.example", "/\n/evil.example", "/\r/evil.example", "/\0", "/studio\u3000", "/\u3000/evil.example", "/studio\u00a0",
      "//evil.example", "///evil.example", "/\\evil.example", "\\\\evil.example", "/studio\\..\\..\\evil",
      "https://evil.example", "http:evil.example", "javascript:alert(1)", "data:text/html,x", "evil.example", "",
      " /studio", "/a/..//evil.example", "/.//evil.example", "/" + "a".repeat(2001), null, undefined, 42, ["/studio"],
    ];
    for (const to of refused) expect([to, safeRedirectPath(to, FALLBACK)]).toEqual([to, FALLBACK]);
  });

  it("whatever it is given, the answer resolves to this site as a browser reads a Location header", () => {
    const base = "https://eonscale.example/login";
    for (let code = 0; code < 0x3100; code++) {
      for (const shape of [`/${String.fromCharCode(code)}/evil.example`, `/${String.fromCharCode(code)}${String.fromCharCode(code)}evil.example`, `${String.fromCharCode(code)}/evil.example`]) {
        const to = safeRedirectPath(shape, FALLBACK);
        expect(new URL(to, base).origin).toBe("https://eonscale.example");
      }
    }
  });
});
