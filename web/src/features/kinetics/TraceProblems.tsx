import type { TraceCsvProblem } from "../../../../shared/kinetics/traceProblemList";
import { Notice } from "../../components/Notice";

/** The first problems found in a trace file, each naming its line, and how many there were. */
export function TraceProblems({ problems, total }: { problems: TraceCsvProblem[]; total: number }) {
  return (
    <Notice tone="error" title={`The trace file has ${total} ${total === 1 ? "problem" : "problems"}`}>
      <ul className="mt-1 list-disc pl-5">
        {problems.map((p) => (
          <li key={`${p.line}-${p.code}-${p.message}`}>{p.message}</li>
        ))}
      </ul>
      {total > problems.length && <p className="mt-1">…and {total - problems.length} more. Correct these and read the file again.</p>}
    </Notice>
  );
}
