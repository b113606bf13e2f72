import "server-only";
import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { settings, type Settings } from "./settings";

/**
 * Object storage through the S3 API. By default it talks to the local fake
 * S3-compatible server that the start and test scripts launch on loopback
 * (scripts/fake-s3.ts); set S3_ENDPOINT (empty for AWS itself), S3_REGION,
 * S3_BUCKET and the two keys to use real object storage instead.
 */
function storageConfig(): Settings["storage"] {
  return settings().storage;
}

const globalForStorage = globalThis as unknown as { gelwrightS3?: S3Client };

function client(): S3Client {
  const config = storageConfig();
  globalForStorage.gelwrightS3 ??= new S3Client({
    endpoint: config.endpoint,
    region: config.region,
    forcePathStyle: config.forcePathStyle,
    credentials: { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey },
    // Plain checksums only when the API requires them, so S3-compatible servers of every age accept our requests.
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
  });
  return globalForStorage.gelwrightS3;
}

/** Stores bytes under `key`. */
export async function putObject(key: string, bytes: Uint8Array, contentType: string): Promise<void> {
  await client().send(
    new PutObjectCommand({ Bucket: storageConfig().bucket, Key: key, Body: bytes, ContentType: contentType, ContentLength: bytes.byteLength }),
  );
}

/** Removes the object under `key` (no error when it is already gone). */
export async function deleteObject(key: string): Promise<void> {
  await client().send(new DeleteObjectCommand({ Bucket: storageConfig().bucket, Key: key }));
}

/** A signed, short-lived link that downloads the object as `fileName`. */
export async function signedDownloadUrl(key: string, fileName: string, contentType: string): Promise<{ url: string; expiresInSeconds: number }> {
  const ascii = fileName.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  const url = await getSignedUrl(
    client(),
    new GetObjectCommand({
      Bucket: storageConfig().bucket,
      Key: key,
      ResponseContentDisposition: `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(fileName)}`,
      ResponseContentType: contentType,
    }),
    { expiresIn: storageConfig().linkSeconds },
  );
  return { url, expiresInSeconds: storageConfig().linkSeconds };
}
