import { csrfToken, errorFromBody, isCsrfRefusal, reportAuthRefusal } from "./uploadSupport";
import { newIdempotencyKey } from "../../api/client";
import type { UploadedFile } from "./types";

/** Progress of an upload: bytes sent of the total. */
export interface UploadProgress {
  sent: number;
  total: number;
}

function sendOnce(file: File, token: string, onProgress: (p: UploadProgress) => void, signal?: AbortSignal): Promise<{ status: number; body: unknown }> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", "/api/files");
    xhr.withCredentials = true;
    xhr.setRequestHeader("Accept", "application/json");
    xhr.setRequestHeader("X-CSRF-Token", token);
    xhr.setRequestHeader("Idempotency-Key", newIdempotencyKey());
    xhr.responseType = "text";
    xhr.upload.onprogress = (event) => onProgress({ sent: event.loaded, total: event.lengthComputable ? event.total : file.size });
    xhr.onload = () => {
      let body: unknown = null;
      try {
        body = xhr.responseText ? JSON.parse(xhr.responseText) : null;
      } catch {
        // Not JSON (a proxy page): the status decides the message.
      }
      resolve({ status: xhr.status, body });
    };
    xhr.onerror = () => reject(errorFromBody(0, null));
    xhr.onabort = () => reject(new DOMException("The upload was cancelled.", "AbortError"));
    signal?.addEventListener("abort", () => xhr.abort(), { once: true });
    const form = new FormData();
    form.append("file", file, file.name);
    xhr.send(form);
  });
}

/** POST /api/files with upload progress (XMLHttpRequest); resolves with the stored file and its SHA-256. */
export async function uploadFile(file: File, onProgress: (p: UploadProgress) => void, signal?: AbortSignal): Promise<UploadedFile> {
  let result = await sendOnce(file, await csrfToken(), onProgress, signal);
  if (result.status === 403) {
    const first = errorFromBody(result.status, result.body);
    if (isCsrfRefusal(first)) result = await sendOnce(file, await csrfToken(true), onProgress, signal);
  }
  if (result.status < 200 || result.status >= 300) {
    const error = errorFromBody(result.status, result.body);
    reportAuthRefusal(error);
    throw error;
  }
  return (result.body as { file: UploadedFile }).file;
}
