// S3 keys of an asset: everything lives under assets/<id>/ (the original, and the content-hashed
// files made from it), so a key tells the sweep which row should own it.
export function assetPrefix(id: number): string {
  return `assets/${id}/`;
}

/** The asset id a key belongs to, or null for keys outside assets/<id>/. */
export function assetIdOfKey(key: string): number | null {
  const m = /^assets\/(\d+)\//.exec(key);
  return m ? Number(m[1]) : null;
}

const EXT = { webp: "webp", jpeg: "jpg", avif: "avif" } as const;

/** A made file's key: its name and the hash of its bytes, e.g. assets/12/960-3fa2…-.webp. */
export function fileKey(id: number, file: { file: string; hash: string; format: keyof typeof EXT }): string {
  const stem = file.file.replace(/\.[a-z]+$/, "");
  return `${assetPrefix(id)}${stem}-${file.hash}.${EXT[file.format]}`;
}
