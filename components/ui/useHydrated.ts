import { useSyncExternalStore } from "react";

const never = () => () => undefined;

/**
 * False in the server's HTML and until React has taken over the page in the browser, true after.
 * A form whose submit runs in the browser keeps its button disabled until then: before it, a click
 * or Enter would do nothing (a form action) or submit the fields the browser's own way, as a GET
 * that puts them in the address (a form with only an onSubmit handler).
 */
export function useHydrated(): boolean {
  return useSyncExternalStore(
    never,
    () => true,
    () => false,
  );
}
