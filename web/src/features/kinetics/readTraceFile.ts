import { createTraceCsvParser, type TraceCsvOptions, type TraceCsvResult } from "../../../../shared/kinetics/traceCsvParser";

/** Bytes read from the file per step; small enough to show progress on a tablet. */
const CHUNK_BYTES = 1 << 20;

/** Reads a trace CSV from a File (or any Blob) in chunks, reporting the share read (0–1). */
export async function readTraceFile(
  file: Blob,
  onProgress: (fraction: number) => void,
  options: TraceCsvOptions = {},
  signal?: AbortSignal,
): Promise<TraceCsvResult> {
  const parser = createTraceCsvParser(options);
  const decoder = new TextDecoder("utf-8");
  onProgress(0);
  for (let start = 0; start < file.size; start += CHUNK_BYTES) {
    if (signal?.aborted) throw new DOMException("The file reading was stopped.", "AbortError");
    const bytes = await file.slice(start, start + CHUNK_BYTES).arrayBuffer();
    parser.push(decoder.decode(bytes, { stream: true }));
    onProgress(Math.min(1, (start + CHUNK_BYTES) / file.size));
  }
  parser.push(decoder.decode());
  const result = parser.finish();
  onProgress(1);
  return result;
}
