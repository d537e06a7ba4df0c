// Keeps a page's data fresh while `stale(data)` holds (a mail still queued):
// the page's own loader is fetched again, first after a second, then less and
// less often (up to every 30 s), so a page left open through a long mail
// outage does not load at a steady pace. A fetcher, not a revalidation, which
// would drop the action's answer (the notice above the form) from the page.
import { useEffect, useState } from "react";
import { useFetcher, useLocation } from "react-router";

const FIRST_MS = 1_000;
const LONGEST_MS = 30_000;

export function useFreshWhile<T>(data: T, stale: (data: T) => boolean): T {
  const fetcher = useFetcher<T>();
  const { pathname, search } = useLocation();
  // What the fetcher brought holds only over the data it was fetched after: a newer page load (an action's) replaces it.
  const [fetchedOver, setFetchedOver] = useState<T | null>(null);
  // The page's own loader answers the fetcher, so its data has the page data's type.
  const fetched = fetcher.data as T | undefined;
  const fresh = fetched !== undefined && fetchedOver === data ? fetched : data;
  const active = stale(fresh);
  const { load } = fetcher;
  useEffect(() => {
    if (!active) return;
    let delay = FIRST_MS;
    let stopped = false;
    let timer: ReturnType<typeof setTimeout>;
    const next = () => {
      if (stopped) return;
      timer = setTimeout(() => {
        setFetchedOver(() => data);
        void load(`${pathname}${search}`).finally(next);
        delay = Math.min(delay * 2, LONGEST_MS);
      }, delay);
    };
    next();
    return () => {
      stopped = true;
      clearTimeout(timer);
    };
  }, [active, data, load, pathname, search]);
  return fresh;
}
