import { describe, expect, it } from "vitest";
import { MAX_BODY_BYTES, action, loader } from "../../app/routes/api.scale";

type AnyArgs = Parameters<typeof action>[0];

function post(body: string | ReadableStream<Uint8Array>, headers: Record<string, string> = { "Content-Type": "application/json" }) {
  const init: RequestInit & { duplex?: string } = { method: "POST", body, headers };
  if (typeof body !== "string") init.duplex = "half";
  return new Request("http://x/api/scale", init);
}

async function call(body: unknown, raw = false) {
  const req = post(raw ? (body as string) : JSON.stringify(body));
  const res = await action({ request: req, params: {}, context: {} } as unknown as AnyArgs);
  expect(res.headers.get("Content-Type")).toMatch(/^application\/json/);
  return { status: res.status, json: (await res.json()) as any };
}

const valid = () => ({
  span: { older: { value: 4567, unit: "Ma" }, younger: { value: 0, unit: "Ma" } },
  medium: { kind: "length", length: { value: 4567, unit: "km" } },
  points: [{ id: "kpg", age: { value: 66, unit: "Ma" }, uncertainty: { value: 0.05, unit: "Ma" } }],
  durations: [{ id: "life", years: 67 }],
});

async function expect400(body: unknown, path: string, message?: RegExp) {
  const r = await call(body);
  expect(r.status).toBe(400);
  expect(typeof r.json.error.message).toBe("string");
  const paths = r.json.error.issues.map((i: { path: string }) => i.path);
  expect(paths).toContain(path);
  if (message) {
    const issue = r.json.error.issues.find((i: { path: string }) => i.path === path);
    expect(issue.message).toMatch(message);
  }
  return r.json;
}

describe("POST /api/scale", () => {
  it("answers the documented example", async () => {
    const r = await call(valid());
    expect(r.status).toBe(200);
    expect(r.json.scale).toMatchObject({ totalMetres: 4_567_000, metresPerYear: 0.001, yearsPerMetre: 1000 });
    expect(r.json.points[0]).toMatchObject({ id: "kpg", fromOlderEndMetres: 4_501_000, fromYoungerEndMetres: 66_000, uncertaintyMetres: 50 });
    expect(r.json.points[0].position).toBeUndefined();
    expect(r.json.durations[0]).toMatchObject({ id: "life", metres: 0.067 }); // 67 mm at 1 km per million years
    expect(Array.isArray(r.json.warnings)).toBe(true);
  });

  it("answers a route request with coordinates, bearing and walking figures", async () => {
    const body = {
      ...valid(),
      medium: { kind: "route", geometry: { type: "LineString", coordinates: [[-2.9, 54.2], [-2.87, 54.2068]] } },
      walkingSpeedMps: 1.1,
      stepLengthM: 0.7,
      mediumType: "trail",
      insets: [{ older: { value: 100, unit: "Ma" }, younger: { value: 0, unit: "a" }, magnification: 10 }],
    };
    const r = await call(body);
    expect(r.status).toBe(200);
    const p = r.json.points[0];
    expect(p.position.lon).toBeGreaterThan(-2.9);
    expect(p.position.lat).toBeGreaterThan(54.2);
    expect(typeof p.bearing).toBe("number");
    expect(p.walking.seconds).toBeCloseTo(p.fromOlderEndMetres / 1.1, 6);
    expect(p.insets[0].insetId).toBe("inset-1");
    expect(r.json.scale.route.walkingSpeedMps).toBe(1.1);
  });

  it("rejects a body that is not JSON", async () => {
    const r = await call("{ span: ", true);
    expect(r.status).toBe(400);
    expect(r.json.error.message).toMatch(/not valid JSON/);
    expect(r.json.error.issues).toEqual([]);
  });

  it("rejects an empty body and a body that is not an object", async () => {
    expect((await call("", true)).status).toBe(400);
    const arr = await call("[1, 2]", true);
    expect(arr.status).toBe(400);
    expect(arr.json.error.message).toMatch(/JSON object/);
    expect((await call("null", true)).status).toBe(400);
  });

  it("rejects a span whose older end is younger than its younger end", async () => {
    const b = valid();
    b.span = { older: { value: 1, unit: "Ma" }, younger: { value: 2, unit: "Ma" } };
    b.points = [];
    await expect400(b, "span.older", /must be older/);
    const equal = valid();
    equal.span.younger = { value: 4567, unit: "Ma" };
    equal.points = [];
    await expect400(equal, "span.older");
  });

  it("rejects ages outside the span", async () => {
    const b = valid();
    b.points.push({ id: "too-old", age: { value: 5, unit: "Ga" } } as (typeof b.points)[0]);
    await expect400(b, "points.1.age", /outside the span/);
    const neg = valid();
    neg.points[0].age.value = -1;
    await expect400(neg, "points.0.age.value", /negative/);
  });

  it("rejects non-positive lengths", async () => {
    const b = valid();
    b.medium.length.value = 0;
    await expect400(b, "medium.length.value", /greater than zero/);
    const n = valid();
    n.medium.length.value = -3;
    await expect400(n, "medium.length.value");
  });

  it("rejects unknown units with the list of accepted ones", async () => {
    const age = valid();
    (age.points[0].age as { unit: string }).unit = "Myr";
    await expect400(age, "points.0.age.unit", /use one of a, ka, Ma, Ga/);
    const len = valid();
    (len.medium.length as { unit: string }).unit = "furlong";
    await expect400(len, "medium.length.unit", /use one of mm, cm, m, km, in, ft, yd, mi/);
    const unc = valid();
    (unc.points[0].uncertainty as { unit: string }).unit = "years";
    await expect400(unc, "points.0.uncertainty.unit");
    const span = valid();
    (span.span.older as { unit: string }).unit = "Gyr";
    await expect400(span, "span.older.unit");
  });

  it("rejects wrong types and missing fields", async () => {
    const str = valid();
    (str.points[0].age as { value: unknown }).value = "66";
    await expect400(str, "points.0.age.value", /finite number/);
    const noSpan = valid() as Partial<ReturnType<typeof valid>>;
    delete noSpan.span;
    await expect400(noSpan, "span", /required/);
    const noId = valid();
    delete (noId.points[0] as { id?: string }).id;
    await expect400(noId, "points.0.id");
    const kind = valid();
    (kind.medium as { kind: string }).kind = "ribbon";
    const r = await call(kind);
    expect(r.status).toBe(400);
    expect(r.json.error.issues[0].path).toMatch(/^medium/);
    const dur = valid();
    dur.durations = [{ id: "life", years: 0 }];
    await expect400(dur, "durations.0.years");
    const dup = valid();
    dup.points.push({ ...dup.points[0] });
    await expect400(dup, "points.1.id", /Duplicate/);
    const speed = { ...valid(), walkingSpeedMps: 0 };
    await expect400(speed, "walkingSpeedMps");
    const mt = { ...valid(), mediumType: "scroll" };
    await expect400(mt, "mediumType");
  });

  it("rejects insets outside the span or without a magnification above 1", async () => {
    const b = { ...valid(), insets: [{ older: { value: 5, unit: "Ga" }, younger: { value: 0, unit: "a" }, magnification: 10 }] };
    await expect400(b, "insets.0", /inside the exhibit's span/);
    const m = { ...valid(), insets: [{ older: { value: 1, unit: "Ma" }, younger: { value: 0, unit: "a" }, magnification: 1 }] };
    await expect400(m, "insets.0.magnification");
    const o = { ...valid(), insets: [{ older: { value: 1, unit: "ka" }, younger: { value: 2, unit: "ka" }, magnification: 10 }] };
    await expect400(o, "insets.0.older");
  });

  it("rejects bad coordinates with their path", async () => {
    const route = (coordinates: unknown) => ({ ...valid(), medium: { kind: "route", geometry: { type: "LineString", coordinates } } });
    await expect400(route([[0, 0], [0, 91]]), "medium.geometry.coordinates.1.1", /−90…90/);
    await expect400(route([[0, 0], [-181, 1]]), "medium.geometry.coordinates.1.0", /−180…180/);
    await expect400(route([[0, 0], [1, "1"]]), "medium.geometry.coordinates.1.1", /finite number/);
    await expect400(route([[0, 0], [0, 0]]), "medium.geometry", /two distinct points/);
    await expect400({ ...valid(), medium: { kind: "route", geometry: { type: "Point", coordinates: [0, 0] } } }, "medium.geometry.type");
    await expect400({ ...valid(), medium: { kind: "route" } }, "medium.geometry", /exactly one/);
    await expect400({ ...valid(), medium: { kind: "route", gpx: "<kml/>" } }, "medium.gpx", /not GPX/);
  });

  it("rejects too many points and too many vertices", async () => {
    const many = valid();
    many.points = Array.from({ length: 5001 }, (_, i) => ({ id: `p${i}`, age: { value: 1, unit: "Ma" } })) as typeof many.points;
    await expect400(many, "points", /At most 5,000 points/);
    const coords = Array.from({ length: 200_001 }, (_, i) => [(i % 1000) * 1e-4, Math.floor(i / 1000) * 1e-4]);
    const big = { ...valid(), medium: { kind: "route", geometry: { type: "LineString", coordinates: coords } } };
    await expect400(big, "medium.geometry", /200,001 vertices; at most 200,000/);
  });

  it("answers 413 for a body over the limit, by Content-Length or while reading", async () => {
    const declared = post("{}", { "Content-Type": "application/json", "Content-Length": String(MAX_BODY_BYTES + 1) });
    const r1 = await action({ request: declared } as unknown as AnyArgs);
    expect(r1.status).toBe(413);
    expect(r1.headers.get("Content-Type")).toMatch(/^application\/json/);
    expect(((await r1.json()) as any).error.message).toMatch(/larger than 5 MB/);

    const chunk = new Uint8Array(1024 * 1024).fill(0x20);
    let sent = 0;
    const stream = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (sent > 6) controller.close();
        else {
          sent++;
          controller.enqueue(chunk);
        }
      },
    });
    const r2 = await action({ request: post(stream) } as unknown as AnyArgs);
    expect(r2.status).toBe(413);
  });

  it("answers 405 with JSON for GET", async () => {
    const res = loader({ request: new Request("http://x/api/scale") } as unknown as Parameters<typeof loader>[0]);
    expect(res.status).toBe(405);
    expect(res.headers.get("Content-Type")).toMatch(/^application\/json/);
    expect(res.headers.get("Allow")).toBe("POST");
    expect(((await res.json()) as any).error.message).toMatch(/POST/);
  });
});
