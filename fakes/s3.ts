// Local S3 stand-in: s3rver on 127.0.0.1, objects stored under <dataDir>/s3.
// Started in the background by fakes/services.ts; run directly with `npx tsx fakes/s3.ts`.
import { mkdirSync } from "node:fs";
import S3rver from "s3rver";
import { serviceConfig } from "./config.ts";
import { onShutdown, writePidFile } from "./process-utils.ts";

// Browsers upload straight to the bucket with presigned URLs, so allow any local origin.
const corsConfig = `<CORSConfiguration>
  <CORSRule>
    <AllowedOrigin>*</AllowedOrigin>
    <AllowedMethod>GET</AllowedMethod>
    <AllowedMethod>HEAD</AllowedMethod>
    <AllowedMethod>PUT</AllowedMethod>
    <AllowedMethod>POST</AllowedMethod>
    <AllowedMethod>DELETE</AllowedMethod>
    <AllowedHeader>*</AllowedHeader>
    <ExposeHeader>ETag</ExposeHeader>
    <MaxAgeSeconds>3000</MaxAgeSeconds>
  </CORSRule>
</CORSConfiguration>`;

const { s3 } = serviceConfig();
mkdirSync(s3.directory, { recursive: true });

const server = new S3rver({
  port: s3.port,
  address: s3.host,
  directory: s3.directory,
  silent: true,
  configureBuckets: [{ name: s3.bucket, configs: [corsConfig] }],
});

try {
  const address = await server.run();
  writePidFile(s3.pidFile);
  console.log(`[s3] s3rver listening on http://${address.address}:${address.port} (bucket ${s3.bucket}, dir ${s3.directory})`);
} catch (error) {
  console.error("[s3] failed to start:", error);
  process.exit(1);
}

onShutdown(s3.pidFile, async () => {
  await server.close();
});
