/** The path a page request asked for, set by proxy.ts, so a sign-in redirect can come back to it. */
export const PATH_HEADER = "x-trailbin-path";
