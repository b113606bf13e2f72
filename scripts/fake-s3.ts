/**
 * A local stand-in for object storage: an S3-compatible server (s3rver) on
 * loopback that stores objects under S3_DATA_DIR (default .data/s3) and has
 * the bucket the app uses. Never use it in production; point S3_ENDPOINT at
 * real object storage instead.
 *
 *   FAKE_S3_PORT (default 4569) · S3_DATA_DIR (default .data/s3) · S3_BUCKET (default gelwright)
 */
import { mkdirSync } from "node:fs";
import { createRequire } from "node:module";

/** The part of s3rver's API used here (the package ships no type declarations). */
interface FakeS3Server {
  run(): Promise<unknown>;
  close(): Promise<unknown>;
}
type FakeS3Constructor = new (options: {
  port: number;
  address: string;
  directory: string;
  silent: boolean;
  configureBuckets: { name: string; configs: string[] }[];
}) => FakeS3Server;
const S3rver = createRequire(import.meta.url)("s3rver") as FakeS3Constructor;

const port = Number(process.env.FAKE_S3_PORT ?? 4569);
const directory = process.env.S3_DATA_DIR ?? ".data/s3";
const bucket = process.env.S3_BUCKET ?? "gelwright";
mkdirSync(directory, { recursive: true });

const server = new S3rver({
  port,
  address: "127.0.0.1",
  directory,
  silent: true,
  configureBuckets: [{ name: bucket, configs: [] }],
});

server
  .run()
  .then(() => console.log(`[fake-s3] listening on 127.0.0.1:${port}, bucket "${bucket}", storing objects in ${directory}`))
  .catch((err: unknown) => {
    console.error("[fake-s3] could not start:", err instanceof Error ? err.message : err);
    process.exit(1);
  });

const stop = () => {
  server.close().then(
    () => process.exit(0),
    () => process.exit(0),
  );
};
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
