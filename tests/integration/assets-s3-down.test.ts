// S3 stopped mid-way, on an s3rver of this file's own (the shared one is never stopped): an upload
// gets a clear 503 and leaves no row and no object; processing retries while S3 is away and, on the
// final attempt, marks the image failed with the reason; when S3 is back, uploads and "Try again" work.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import S3rver from "s3rver";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as apiAsset from "../../app/routes/api.assets.$id.ts";
import * as apiAssets from "../../app/routes/api.assets.ts";
import { Asset, type Organisation } from "../../db/models/index.ts";
import { processAsset } from "../../server/assets/jobs.server.ts";
import { listObjects, StorageUnavailableError } from "../../server/storage/s3.server.ts";
import { cookieFor, createMember, createOrganisation, formRequest, routeArgs } from "../helpers/db.ts";
import { jpegWithGps, uploadRequest, useOwnBucket } from "../helpers/images.ts";
import { freePort } from "../helpers/net.ts";

let org: Organisation;
let designer: string;
let s3: S3rver | null = null;
let port: number;
const directory = mkdtempSync(path.join(tmpdir(), "eonscale-s3-down-"));

async function startS3() {
  s3 = new S3rver({ port, address: "127.0.0.1", directory, silent: true });
  await s3.run();
}
async function stopS3() {
  await s3?.close();
  s3 = null;
}

async function upload(bytes: Uint8Array) {
  const res = await apiAssets.action(routeArgs(uploadRequest([{ name: "site.jpg", type: "image/jpeg", bytes }], designer)));
  return { status: res.status, body: (await res.json()) as { id?: number; error?: { message: string } } };
}

beforeAll(async () => {
  port = await freePort();
  await startS3();
  await useOwnBucket("down-test", `http://127.0.0.1:${port}`);
  org = await createOrganisation();
  designer = await cookieFor((await createMember(org, "designer")).user.id);
});

afterAll(async () => {
  await stopS3();
  rmSync(directory, { recursive: true, force: true });
});

describe("S3 stopped mid-way", () => {
  it("refuses the upload with a clear 503 and leaves nothing half-made; works again when S3 is back", async () => {
    const bytes = await jpegWithGps(800, 600);
    const first = await upload(bytes);
    expect(first.status).toBe(201);
    const rowsBefore = await Asset.count();

    await stopS3();
    const down = await upload(bytes);
    expect(down.status).toBe(503);
    expect(down.body.error?.message).toBe("The image store is not reachable right now, so nothing was saved. Try again in a minute.");
    expect(await Asset.count()).toBe(rowsBefore);

    await startS3();
    const keys = (await listObjects("assets/")).map((o) => o.key);
    expect(keys).toEqual([`assets/${first.body.id}/original`]);
    const again = await upload(bytes);
    expect(again.status).toBe(201);
    expect(await Asset.count()).toBe(rowsBefore + 1);
  });

  it("retries processing while S3 is away, fails with the reason on the final attempt, and “Try again” finishes it", async () => {
    const { body } = await upload(await jpegWithGps(1000, 700));
    const id = body.id!;
    await stopS3();
    await expect(processAsset(id)).rejects.toBeInstanceOf(StorageUnavailableError);
    expect((await Asset.findByPk(id))!.status).toBe("processing");
    expect(await processAsset(id, { finalAttempt: true })).toBe("failed");
    const failed = await apiAsset.loader(routeArgs(new Request(`http://test.local/api/assets/${id}`, { headers: { Cookie: designer } }), { id: String(id) }));
    expect(await failed.json()).toMatchObject({ id, status: "failed", error: expect.stringMatching(/image store was not reachable/) });

    await startS3();
    const retried = await apiAsset.action(routeArgs(formRequest(`/api/assets/${id}`, { intent: "retry" }, { cookie: designer }), { id: String(id) }));
    expect(retried.status).toBe(202);
    expect((await Asset.findByPk(id))!.status).toBe("processing");
    expect(await processAsset(id)).toBe("ready");
    const notFailed = await apiAsset.action(routeArgs(formRequest(`/api/assets/${id}`, { intent: "retry" }, { cookie: designer }), { id: String(id) }));
    expect(notFailed.status).toBe(409);
  });
});
