// Canonical JSON (RFC 8785, the JSON Canonicalization Scheme, via the `canonicalize` package): keys
// sorted, no whitespace, numbers in their shortest ECMAScript form. The publication hash is the
// SHA-256 of these bytes (taken on the server), and the public API serves them as they are.
import canonicalize from "canonicalize";

/** RFC 8785 text of a JSON value. Refuses what JSON cannot hold (undefined at the top, NaN, Infinity). */
export function canonicalJson(value: unknown): string {
  assertJsonSafe(value, "$");
  const text = canonicalize(value);
  if (text === undefined) throw new Error("canonicalJson: the value has no JSON form");
  return text;
}

function assertJsonSafe(value: unknown, path: string): void {
  if (typeof value === "number" && !Number.isFinite(value)) throw new Error(`canonicalJson: ${path} is ${value}, which JSON cannot hold`);
  if (Array.isArray(value)) value.forEach((v, i) => assertJsonSafe(v, `${path}[${i}]`));
  else if (value && typeof value === "object") for (const [k, v] of Object.entries(value)) assertJsonSafe(v, `${path}.${k}`);
}

/**
 * The public response body for a publication: `{"publication":{…},"snapshot":{…}}` in canonical
 * form, built from the stored canonical snapshot text (so the bytes never depend on how JSONB
 * returned the snapshot).
 */
export function publicationBody(meta: unknown, snapshotCanonical: string): string {
  return `{"publication":${canonicalJson(meta)},"snapshot":${snapshotCanonical}}`;
}
