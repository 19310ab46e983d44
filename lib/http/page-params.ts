import { notFound } from "next/navigation";
import { parseId } from "./params";

/** The id in a page's URL, or the not-found page: the same rule as the handlers' `idParam`. */
export function pageId(value: string): number {
  const id = parseId(value);
  if (id === null) notFound();
  return id;
}
