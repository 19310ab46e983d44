import type { ApiFailure } from "@/lib/client/fetch-json";
import { FieldErrors } from "./FieldErrors";

/** What the server said was wrong, with the fields it named. */
export function FailureNotice({ failure }: { failure: ApiFailure | null }) {
  if (!failure) return null;
  return (
    <div role="alert" className="notice-error">
      <p className="font-semibold">{failure.message}</p>
      <FieldErrors issues={failure.issues} />
    </div>
  );
}
