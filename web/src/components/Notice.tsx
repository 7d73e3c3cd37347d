import type { ReactNode } from "react";

type Tone = "info" | "success" | "error";

const TONE_CLASSES: Record<Tone, string> = {
  info: "border-fen-700 bg-fen-50 text-ink-950",
  success: "border-ok-800 bg-ok-50 text-ok-800",
  error: "border-alarm-800 bg-alarm-50 text-alarm-800",
};

export interface NoticeProps {
  tone?: Tone;
  title?: string;
  children: ReactNode;
}

/** A message box; errors are announced at once (role=alert), others politely (role=status). */
export function Notice({ tone = "info", title, children }: NoticeProps) {
  return (
    <div
      role={tone === "error" ? "alert" : "status"}
      className={`rounded-md border-l-8 px-4 py-3 ${TONE_CLASSES[tone]}`}
    >
      {title && <p className="font-bold">{title}</p>}
      <div>{children}</div>
    </div>
  );
}
