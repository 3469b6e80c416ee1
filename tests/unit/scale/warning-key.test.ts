// warningKey: the code and the ids in table order, whatever was asked before, and a caller's
// array changed in place afterwards must not change a later answer.
import { describe, expect, it } from "vitest";
import { warningKey } from "../../../app/lib/scale/numbering";

describe("warningKey", () => {
  it("is the code and the ids in table order, asked again with the same, other or reordered ids", () => {
    expect(warningKey("markers-too-close", ["140", "137"])).toBe("markers-too-close:137,140");
    expect(warningKey("markers-too-close", ["140", "137"])).toBe("markers-too-close:137,140");
    expect(warningKey("markers-too-close", ["137", "140"])).toBe("markers-too-close:137,140");
    expect(warningKey("markers-too-close", ["137", "141"])).toBe("markers-too-close:137,141");
    expect(warningKey("same-age", ["137", "141"])).toBe("same-age:137,141");
    expect(warningKey("markers-too-close", ["b", "a", "10", "9"])).toBe("markers-too-close:9,10,a,b");
    const ids = Array.from({ length: 1000 }, (_, i) => String(i + 1));
    const key = warningKey("markers-too-close", ids);
    expect(key).toBe(`markers-too-close:${ids.join(",")}`);
    ids[999] = "2000"; // changed in place: the earlier answer must not stand for it
    expect(warningKey("markers-too-close", ids)).toBe(`markers-too-close:${ids.join(",")}`);
    ids.pop();
    expect(warningKey("markers-too-close", ids)).toBe(`markers-too-close:${ids.join(",")}`);
  });

  it("answers right for many codes, each asked twice", () => {
    for (let round = 0; round < 2; round++) for (let c = 0; c < 100; c++) expect(warningKey(`code-${c}`, ["2", "1"])).toBe(`code-${c}:1,2`);
  });
});
