import { notFound } from "next/navigation";

/** Any console address no page has: the console's own not-found page, inside the console (404). */
export default function MissingConsolePage() {
  notFound();
}
