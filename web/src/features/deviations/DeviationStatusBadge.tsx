import { DEVIATION_STATUS_MARKERS, DEVIATION_STATUS_WORDS, SEVERITY_WORDS } from "./deviationWords";

const STATUS_CLASSES = {
  open: "border-alarm-800 bg-alarm-50 text-alarm-800",
  investigated: "border-caution-500 bg-caution-50 text-caution-800",
  closed: "border-ok-800 bg-ok-50 text-ok-800",
} as const;

/** A deviation's status in words with a shape beside them. */
export function DeviationStatusBadge({ status }: { status: keyof typeof STATUS_CLASSES }) {
  return (
    <span className={`inline-flex items-center gap-1.5 rounded-sm border px-2 text-[0.85rem] font-semibold whitespace-nowrap ${STATUS_CLASSES[status]}`}>
      <span aria-hidden="true">{DEVIATION_STATUS_MARKERS[status]}</span>
      {DEVIATION_STATUS_WORDS[status]}
    </span>
  );
}

/** A severity in words; critical is written in capitals as well as tinted. */
export function SeverityLabel({ severity }: { severity: keyof typeof SEVERITY_WORDS }) {
  return <span className={`font-semibold ${severity === "critical" ? "text-alarm-800 uppercase" : severity === "major" ? "text-caution-800" : ""}`}>{SEVERITY_WORDS[severity]}</span>;
}
