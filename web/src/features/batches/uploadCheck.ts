/** The server's default upload limit; a site may set another, and then the server's answer counts. */
export const DEFAULT_UPLOAD_LIMIT_BYTES = 25 * 1024 * 1024;

const ACCEPTED_EXTENSIONS = [".png", ".jpg", ".jpeg", ".pdf", ".csv", ".tsv", ".txt", ".log"];

/** What the file pickers offer: photos, printouts and logger files. */
export const ACCEPT_ATTACHMENT = ".png,.jpg,.jpeg,.pdf,.csv,.tsv,.txt,.log,image/png,image/jpeg,application/pdf,text/csv,text/plain";
export const ACCEPT_TRACE = ".csv,.tsv,.txt,text/csv,text/plain";

/** A size in bytes as people read it, e.g. "1.4 MB". */
export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} kB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}

/**
 * A quick check before sending, so an obviously wrong file is refused at once. The server
 * judges the type from the bytes and has the last word.
 */
export function precheckFile(file: File, kind: "attachment" | "trace"): string | null {
  if (file.size === 0) return "The file is empty.";
  if (file.size > DEFAULT_UPLOAD_LIMIT_BYTES) return `The file is ${formatBytes(file.size)}; the limit is ${formatBytes(DEFAULT_UPLOAD_LIMIT_BYTES)}.`;
  const name = file.name.toLowerCase();
  if (kind === "trace") {
    return /\.(csv|tsv|txt)$/.test(name) ? null : "A logger trace must be a CSV file (.csv).";
  }
  return ACCEPTED_EXTENSIONS.some((ext) => name.endsWith(ext)) ? null : "Accepted: PNG or JPEG photos, PDF printouts, CSV or plain-text logger files.";
}
