import { z } from "zod";

/** Ids and version counters live in MariaDB INT columns: nothing Trailbin hands out goes past this. */
export const MAX_ROW_NUMBER = 2_147_483_647;

/** The id of a stored record, as a JSON number. */
export const rowId = (what: string) =>
  z
    .number()
    .int(`Choose the ${what} from the list.`)
    .min(1, `Choose the ${what} from the list.`)
    .max(MAX_ROW_NUMBER, `No ${what} has that number. Choose it from the list.`);

/** The version a page loaded, sent back so a stale change is refused (optimistic locking). */
export const rowVersion = () =>
  z
    .number()
    .int("Reload the page: that is not a version Trailbin gave out.")
    .min(1, "Reload the page: that is not a version Trailbin gave out.")
    .max(MAX_ROW_NUMBER, "Reload the page: that is not a version Trailbin gave out.");
