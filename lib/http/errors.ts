/** An error a person can act on: the message is shown to them as it is. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly extra?: Record<string, unknown>,
  ) {
    super(message);
  }
}

export function jsonError(status: number, message: string, extra?: Record<string, unknown>): Response {
  return Response.json({ error: message, ...extra }, { status });
}

/** The 400 for a request whose fields a person must correct, each with what is wrong with it. */
export function fieldsNeedAttention(issues: { path: string; message: string }[]): HttpError {
  return new HttpError(400, "Some fields need attention.", { issues });
}
