import type { ReactNode } from "react";

export interface CalmErrorProps {
  title: string;
  children: ReactNode;
  actions: ReactNode;
}

/** The full-page layout for anything that went wrong: a plain message and a way back. */
export function CalmError({ title, children, actions }: CalmErrorProps) {
  return (
    <main id="main" className="mx-auto flex max-w-2xl flex-col gap-4 px-5 py-16">
      <p className="font-bold tracking-wide text-fen-700">Isobatch</p>
      <h1 className="text-3xl font-bold">{title}</h1>
      <div className="flex flex-col gap-2 text-ink-800">{children}</div>
      <div className="flex flex-wrap gap-3">{actions}</div>
    </main>
  );
}
