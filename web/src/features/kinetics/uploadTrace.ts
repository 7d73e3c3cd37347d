import { ApiError, newIdempotencyKey } from "../../api/client";
import { queryClient } from "../../api/queryClient";
import { sessionQueryOptions } from "../session/queries";
import type { TraceCsvProblem } from "../../../../shared/kinetics/traceProblemList";

/** An API refusal of an uploaded trace, with the CSV problems when the file itself was at fault. */
export class TraceUploadError extends ApiError {
  readonly problems: TraceCsvProblem[];
  readonly totalProblems: number;

  constructor(status: number, code: string, message: string, field: string | undefined, problems: TraceCsvProblem[] = [], totalProblems = 0) {
    super(status, code, message, field);
    this.name = "TraceUploadError";
    this.problems = problems;
    this.totalProblems = totalProblems;
  }
}

function refusal(xhr: XMLHttpRequest): TraceUploadError {
  let body: { error?: { code?: string; message?: string; field?: string; problems?: TraceCsvProblem[]; totalProblems?: number } } | null = null;
  try {
    body = JSON.parse(xhr.responseText);
  } catch {
    // Not JSON: fall through to the general message.
  }
  const error = body?.error;
  if (error?.code) return new TraceUploadError(xhr.status, error.code, error.message ?? "The request was refused.", error.field, error.problems, error.totalProblems);
  return new TraceUploadError(xhr.status, `http-${xhr.status}`, xhr.status >= 500 ? "The Isobatch server had a problem with this request. Try again in a moment." : "The request was refused.", undefined);
}

/**
 * Sends a trace file with its JSON params as multipart/form-data ("params" first, then "file"),
 * reporting the share uploaded (0–1), and returns the parsed answer.
 */
export async function uploadTrace<T>(path: string, params: unknown, file: Blob, fileName: string, onProgress: (fraction: number) => void): Promise<T> {
  const csrf = (await queryClient.ensureQueryData(sessionQueryOptions())).csrfToken;
  const form = new FormData();
  form.append("params", JSON.stringify(params));
  form.append("file", file, fileName);
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", path);
    xhr.withCredentials = true;
    xhr.setRequestHeader("X-CSRF-Token", csrf);
    xhr.setRequestHeader("Idempotency-Key", newIdempotencyKey());
    xhr.setRequestHeader("Accept", "application/json");
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress(event.loaded / event.total);
    };
    xhr.upload.onload = () => onProgress(1);
    xhr.onload = () => {
      if (xhr.status >= 200 && xhr.status < 300) {
        try {
          resolve(JSON.parse(xhr.responseText) as T);
        } catch {
          reject(new TraceUploadError(xhr.status, "invalid-answer", "The server's answer could not be read.", undefined));
        }
      } else reject(refusal(xhr));
    };
    xhr.onerror = () => reject(new TraceUploadError(0, "network-unreachable", "Isobatch could not reach the server. Check the network connection and try again.", undefined));
    xhr.send(form);
  });
}
