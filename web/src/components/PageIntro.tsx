import type { ReactNode } from "react";

/** The heading and one-paragraph purpose at the top of a screen. */
export function PageIntro({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div className="flex max-w-3xl flex-col gap-2">
      <h1 className="text-3xl font-bold">{title}</h1>
      <div className="text-ink-800">{children}</div>
    </div>
  );
}
