import busboy from "busboy";
import type { Request } from "express";
import type { Readable } from "node:stream";
import { createTraceCsvParser, type TraceCsvOptions, type TraceCsvResult } from "../../../shared/kinetics/index.js";
import { HttpError } from "../../http/errors.js";
import { formatBytes } from "../../commands/fileReceiver.js";

/** The "params" part is a small JSON document; anything bigger is refused. */
const PARAMS_MAX_BYTES = 64 * 1024;

export interface TraceUpload<P> {
  params: P;
  csv: TraceCsvResult;
}

export interface TraceUploadRules<P> {
  maxBytes: number;
  /** Parses and validates the "params" text; throws an HttpError naming the field. */
  readParams: (text: string) => P;
  /** CSV reading options carried in the params, if any. */
  csvOptionsOf: (params: P) => TraceCsvOptions | undefined;
}

const tooLarge = (max: number) => new HttpError(413, "file-too-large", `The trace file is larger than the limit of ${formatBytes(max)}.`, "file");
const unreadable = () => new HttpError(400, "invalid-multipart", "The multipart body could not be read.", "file");

/**
 * Reads a multipart upload with a "params" JSON part and a "file" trace CSV, streaming the file
 * through the trace parser as it arrives (UTF-8 decoded in stream mode). Nothing is stored.
 */
export function readTraceUpload<P>(req: Request, rules: TraceUploadRules<P>): Promise<TraceUpload<P>> {
  const { maxBytes } = rules;
  const declared = Number(req.get("content-length") ?? 0);
  if (declared > maxBytes + PARAMS_MAX_BYTES + 64 * 1024) return Promise.reject(tooLarge(maxBytes));
  return new Promise((ok, fail) => {
    let bb: busboy.Busboy;
    try {
      bb = busboy({ headers: req.headers, limits: { files: 1, fileSize: maxBytes + 1, fields: 5, fieldSize: PARAMS_MAX_BYTES } });
    } catch {
      return fail(unreadable());
    }
    let settled = false;
    let params: P | undefined;
    let fileSeen = false;
    let csv: TraceCsvResult | undefined;
    let fileEnded: Promise<void> = Promise.resolve();
    const stop = (error: unknown) => {
      if (settled) return;
      settled = true;
      // Drain what the client is still sending so the refusal reaches it.
      req.unpipe(bb);
      req.resume();
      fail(error);
    };

    bb.on("field", (name, value, info) => {
      if (settled || name !== "params") return;
      if (info.valueTruncated) return stop(new HttpError(413, "params-too-large", `The params part is larger than ${formatBytes(PARAMS_MAX_BYTES)}.`, "params"));
      try {
        params = rules.readParams(value);
      } catch (error) {
        return stop(error);
      }
      if (fileSeen && rules.csvOptionsOf(params) !== undefined) {
        stop(new HttpError(400, "params-after-file", "The params part sets csv options, so it must come before the file part.", "params"));
      }
    });

    bb.on("file", (name, stream: Readable) => {
      if (settled || name !== "file" || fileSeen) {
        stream.resume();
        return;
      }
      fileSeen = true;
      const parser = createTraceCsvParser(params === undefined ? {} : (rules.csvOptionsOf(params) ?? {}));
      const decoder = new TextDecoder("utf-8", { fatal: true });
      let bytes = 0;
      fileEnded = new Promise((done) => {
        stream.on("data", (chunk: Buffer) => {
          if (settled) return;
          bytes += chunk.length;
          if (bytes > maxBytes) return stop(tooLarge(maxBytes));
          try {
            parser.push(decoder.decode(chunk, { stream: true }));
          } catch {
            stop(new HttpError(422, "file-not-text", "The trace file is not UTF-8 text; export it from the logger as CSV.", "file"));
          }
        });
        stream.on("limit", () => stop(tooLarge(maxBytes)));
        stream.on("end", () => {
          if (!settled) {
            try {
              parser.push(decoder.decode());
              csv = parser.finish();
            } catch {
              stop(new HttpError(422, "file-not-text", "The trace file is not UTF-8 text; export it from the logger as CSV.", "file"));
            }
          }
          done();
        });
      });
    });

    bb.on("error", () => stop(unreadable()));
    bb.on("close", () => {
      void fileEnded.then(() => {
        if (settled) return;
        if (!fileSeen) return stop(new HttpError(400, "file-missing", "No part named \"file\" was sent: attach the trace CSV.", "file"));
        if (params === undefined) return stop(new HttpError(400, "params-missing", "No part named \"params\" was sent: add the JSON parameters.", "params"));
        if (csv === undefined) return stop(unreadable());
        settled = true;
        ok({ params, csv });
      });
    });
    req.pipe(bb);
  });
}
