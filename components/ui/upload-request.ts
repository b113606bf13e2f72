"use client";

import { ApiRequestError, apiErrorFrom } from "@/lib/client/fetcher";

/** Progress of an upload: bytes sent so far of the total (total 0 when unknown). */
export interface UploadProgress {
  loaded: number;
  total: number;
}

/**
 * POSTs a multipart form with XMLHttpRequest so the page can show how much
 * has been sent (fetch cannot report upload progress). Resolves with the
 * parsed JSON answer; rejects with ApiRequestError carrying the server's
 * { error: { code, message, fields? } } body.
 */
export function uploadWithProgress<T>(url: string, form: FormData, onProgress: (p: UploadProgress) => void): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", url);
    xhr.withCredentials = true;
    xhr.setRequestHeader("accept", "application/json");
    xhr.upload.onprogress = (e) => onProgress({ loaded: e.loaded, total: e.lengthComputable ? e.total : 0 });
    xhr.onerror = () => reject(new ApiRequestError(0, "network", "The server could not be reached. Nothing was uploaded; try again."));
    xhr.onabort = () => reject(new ApiRequestError(0, "aborted", "The upload was cancelled."));
    xhr.onload = () => {
      let body: unknown = null;
      try {
        body = xhr.responseText ? JSON.parse(xhr.responseText) : null;
      } catch {
        // Not JSON: a proxy page, say.
      }
      if (xhr.status >= 200 && xhr.status < 300) {
        resolve(body as T);
        return;
      }
      reject(apiErrorFrom(xhr.status, body));
    };
    xhr.send(form);
  });
}

/** "2.4 MB", "512 KB", "900 bytes". */
export function fmtBytes(bytes: number): string {
  if (bytes >= 1024 * 1024) return `${(bytes / 1024 / 1024).toFixed(1)}\u00a0MB`;
  if (bytes >= 1024) return `${Math.round(bytes / 1024)}\u00a0KB`;
  return `${bytes}\u00a0bytes`;
}
