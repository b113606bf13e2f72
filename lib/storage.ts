import "server-only";
import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";

/**
 * Object storage through the S3 API. By default it talks to the local fake
 * S3-compatible server that the start and test scripts launch on loopback
 * (scripts/fake-s3.ts); set S3_ENDPOINT (empty for AWS itself), S3_REGION,
 * S3_BUCKET and the two keys to use real object storage instead.
 */
export const storageConfig = {
  endpoint: process.env.S3_ENDPOINT === undefined ? "http://127.0.0.1:4569" : process.env.S3_ENDPOINT || undefined,
  bucket: process.env.S3_BUCKET ?? "gelwright",
  region: process.env.S3_REGION ?? "us-east-1",
  // s3rver's fixed development keys; real storage needs real ones.
  accessKeyId: process.env.S3_ACCESS_KEY_ID ?? "S3RVER",
  secretAccessKey: process.env.S3_SECRET_ACCESS_KEY ?? "S3RVER",
  forcePathStyle: (process.env.S3_FORCE_PATH_STYLE ?? (process.env.S3_ENDPOINT === "" ? "false" : "true")) === "true",
  /** Lifetime of a download link, s. */
  linkSeconds: Number(process.env.S3_LINK_SECONDS ?? 300),
} as const;

const globalForStorage = globalThis as unknown as { gelwrightS3?: S3Client };

function client(): S3Client {
  globalForStorage.gelwrightS3 ??= new S3Client({
    endpoint: storageConfig.endpoint,
    region: storageConfig.region,
    forcePathStyle: storageConfig.forcePathStyle,
    credentials: { accessKeyId: storageConfig.accessKeyId, secretAccessKey: storageConfig.secretAccessKey },
    // Plain checksums only when the API requires them, so S3-compatible servers of every age accept our requests.
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
  });
  return globalForStorage.gelwrightS3;
}

/** Stores bytes under `key`. */
export async function putObject(key: string, bytes: Uint8Array, contentType: string): Promise<void> {
  await client().send(
    new PutObjectCommand({ Bucket: storageConfig.bucket, Key: key, Body: bytes, ContentType: contentType, ContentLength: bytes.byteLength }),
  );
}

/** Removes the object under `key` (no error when it is already gone). */
export async function deleteObject(key: string): Promise<void> {
  await client().send(new DeleteObjectCommand({ Bucket: storageConfig.bucket, Key: key }));
}

/** A signed, short-lived link that downloads the object as `fileName`. */
export async function signedDownloadUrl(key: string, fileName: string, contentType: string): Promise<{ url: string; expiresInSeconds: number }> {
  const ascii = fileName.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  const url = await getSignedUrl(
    client(),
    new GetObjectCommand({
      Bucket: storageConfig.bucket,
      Key: key,
      ResponseContentDisposition: `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(fileName)}`,
      ResponseContentType: contentType,
    }),
    { expiresIn: storageConfig.linkSeconds },
  );
  return { url, expiresInSeconds: storageConfig.linkSeconds };
}
