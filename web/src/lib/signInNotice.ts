import { useSyncExternalStore } from "react";

// Kept outside the router's location state: the shell's own redirect to /sign-in can
// replace that state in the same moment the session ends.
let notice: string | null = null;
const listeners = new Set<() => void>();

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** Sets (or clears, with null) the message shown above the sign-in form. */
export function setSignInNotice(text: string | null): void {
  notice = text;
  for (const listener of listeners) listener();
}

/** The message for the sign-in screen, e.g. why the last session ended. */
export function useSignInNotice(): string | null {
  return useSyncExternalStore(subscribe, () => notice);
}
