import { useQuery } from "@tanstack/react-query";
import { sessionQueryOptions } from "./queries";

/** The current session query; `user` is null when nobody is signed in. */
export function useSession() {
  const query = useQuery(sessionQueryOptions());
  return { ...query, user: query.data?.user ?? null };
}
