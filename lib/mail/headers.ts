// Header fields (subject, display names) are built from text people typed. A CR or LF in one would
// start a new header line ("Bcc: …") in the message, so every control character becomes a space.
// Pure: no Next, no database; unit-tested in tests/unit/mail.

// eslint-disable-next-line no-control-regex
const CONTROL = /[\u0000-\u001f\u007f\u0085\u2028\u2029]+/g;

/** Text safe for a header field: no control characters or line breaks, spaces collapsed, capped. */
export function headerText(value: string, max = 200): string {
  return value.replace(CONTROL, " ").replace(/\s+/g, " ").trim().slice(0, max);
}

/** True when the text holds a character that headerText would have to remove. */
export function hasControlCharacters(value: string): boolean {
  return new RegExp(CONTROL.source).test(value);
}

// A deliberately plain address: local@domain, no quotes, comments, spaces, angle brackets or commas,
// so an address can never smuggle a second recipient or a header into the envelope.
const ADDRESS =
  /^[A-Za-z0-9.!#$%&'*+/=?^_`{|}~-]{1,64}@[A-Za-z0-9](?:[A-Za-z0-9-]{0,61}[A-Za-z0-9])?(?:\.[A-Za-z0-9](?:[A-Za-z0-9-]{0,61}[A-Za-z0-9])?)+$/;

export function isValidAddress(address: string): boolean {
  return address.length <= 254 && ADDRESS.test(address) && !address.includes("..");
}

export class InvalidAddressError extends Error {
  constructor(address: string) {
    super(`Not a usable e-mail address: ${JSON.stringify(address.slice(0, 80))}`);
  }
}
