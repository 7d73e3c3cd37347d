import { ApiError } from "../../api/client";

export interface TraceProblem {
  line: number;
  message: string;
}

/** The problems a refused trace file carries (error.problems, each naming its line), and how many in all. */
export function traceProblemsOf(error: unknown): { problems: TraceProblem[]; total: number } {
  if (!(error instanceof ApiError)) return { problems: [], total: 0 };
  const list = Array.isArray(error.details.problems) ? error.details.problems : [];
  const problems = list.filter((p): p is TraceProblem => typeof p?.message === "string" && typeof p?.line === "number");
  const total = typeof error.details.totalProblems === "number" ? error.details.totalProblems : problems.length;
  return { problems, total };
}
