/** How each deviation status reads, with a shape beside the words. */
export const DEVIATION_STATUS_WORDS = { open: "Open", investigated: "Investigated — waits for closing", closed: "Closed" } as const;
export const DEVIATION_STATUS_MARKERS = { open: "◇", investigated: "◈", closed: "◆" } as const;

/** Severity words; "critical" also stops release until closed, like any open deviation. */
export const SEVERITY_WORDS = { minor: "Minor", major: "Major", critical: "Critical" } as const;

/** Where a deviation came from, in words. */
export function sourceWords(source: string): string {
  if (source === "person") return "Raised by a person";
  if (source === "relief-pressure") return "Raised by the relief-pressure check";
  if (source === "rated-volume") return "Raised by the rated-volume check";
  if (source === "kinetics") return "Raised by the kinetics check";
  return `Raised by ${source}`;
}
