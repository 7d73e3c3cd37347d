import { limitsAtScaleText, perLitreNote } from "./fieldText";
import type { BatchStepView } from "./types";

const KIND_WORDS = { number: "number", text: "text", choice: "choice", datetime: "date and time", attachment: "file" } as const;

/** The fields a step asks for, with unit and limits at this scale, for people who only read the step. */
export function FieldSummary({ step, v0L }: { step: BatchStepView; v0L: number }) {
  if (step.fields.length === 0) return <p className="text-ink-600">This step asks for no entries.</p>;
  return (
    <ul className="flex flex-col gap-1">
      {step.fields.map((field) => {
        const limits = limitsAtScaleText(field);
        const note = perLitreNote(field, v0L);
        return (
          <li key={field.key}>
            <span className="font-semibold">{field.label}</span>
            {field.required ? "" : " (optional)"} — {KIND_WORDS[field.kind]}
            {field.kind === "number" && field.unit ? ` in ${field.unit}` : ""}
            {field.kind === "choice" ? `: ${field.choices.join(" / ")}` : ""}
            {limits && <span>; limits {limits}</span>}
            {note && <span className="block text-[0.9rem] text-ink-700">{note}</span>}
          </li>
        );
      })}
    </ul>
  );
}
