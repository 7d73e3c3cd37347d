type Tone = "ok" | "pending" | "stopped" | "plain";

const TONE_CLASSES: Record<Tone, string> = {
  ok: "border-ok-800 bg-ok-50 text-ok-800",
  pending: "border-caution-500 bg-caution-50 text-caution-800",
  stopped: "border-alarm-800 bg-alarm-50 text-alarm-800",
  plain: "border-ink-400 bg-white text-ink-800",
};

const STATUS_TONES: Record<string, Tone> = {
  approved: "ok",
  "in-service": "ok",
  draft: "pending",
  "out-of-service": "stopped",
  superseded: "plain",
};

const STATUS_WORDS: Record<string, string> = {
  approved: "Approved",
  draft: "Draft",
  superseded: "Superseded",
  "in-service": "In service",
  "out-of-service": "Out of service",
};

/** A record's status in words inside a tinted box; the word carries the meaning, not the colour. */
export function StatusBadge({ status }: { status: string }) {
  const tone = STATUS_TONES[status] ?? "plain";
  return (
    <span
      className={`inline-block rounded-sm border px-2 text-[0.85rem] font-semibold whitespace-nowrap ${TONE_CLASSES[tone]}`}
    >
      {STATUS_WORDS[status] ?? status}
    </span>
  );
}
