import { useCallback, useRef, useState } from "react";
import { ApiError } from "../../api/client";
import { uploadFile, type UploadProgress } from "./fileUpload";
import { precheckFile } from "./uploadCheck";
import type { UploadedFile } from "./types";

/** One file upload at a time with its progress; the quick client check runs first, the server's answer counts. */
export function useFileUpload(kind: "attachment" | "trace") {
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const [uploaded, setUploaded] = useState<UploadedFile | null>(null);
  const busy = useRef(false);

  const upload = useCallback(
    async (file: File): Promise<UploadedFile> => {
      if (busy.current) throw new ApiError(0, "upload-busy", "A file is already being uploaded; wait for it to finish.", "file", {});
      const problem = precheckFile(file, kind);
      if (problem) throw new ApiError(0, "precheck", problem, "file", {});
      busy.current = true;
      setUploaded(null);
      setProgress({ sent: 0, total: file.size });
      try {
        const stored = await uploadFile(file, setProgress);
        setUploaded(stored);
        return stored;
      } finally {
        busy.current = false;
        setProgress(null);
      }
    },
    [kind],
  );

  return { upload, progress, uploaded, reset: () => setUploaded(null) };
}
