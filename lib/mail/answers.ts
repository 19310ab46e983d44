// What the password pages and their handlers say; shared so the tests hold both to the same words.
export const LINK_DEAD = "This link has been used or has expired. Ask for a new one.";

export const RESET_ANSWER =
  "If that address belongs to an active Trailbin account, a mail with a link to choose a new password is on its way. The link works once, for 1 hour.";
