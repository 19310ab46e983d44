"use client";

import Link from "next/link";
import { useState } from "react";
import useSWR from "swr";
import { swrFetcher } from "@/lib/client/fetch-json";
import { draftUrl, type DraftResponse } from "./api";
import { EditorSession } from "./EditorSession";
import { useDateStyle } from "@/components/SiteFormat";
import { formatDateTime } from "@/lib/format/dates";

type Props = { floorPlanId: number; canEdit: boolean };

/**
 * The floor-plan editor for one plan's draft. The session is mounted once per loaded draft and not
 * refreshed behind the person's back: a newer draft only replaces theirs when they ask to reload.
 */
export function FloorPlanEditor({ floorPlanId, canEdit }: Props) {
  const [loads, setLoads] = useState(0);
  const style = useDateStyle();
  const { data, error, isLoading, mutate } = useSWR<DraftResponse>(draftUrl(floorPlanId), swrFetcher, {
    revalidateOnFocus: false,
    revalidateOnReconnect: false,
    revalidateIfStale: false,
  });

  if (error) {
    return (
      <div className="notice-error" role="alert">
        <p>The draft could not be loaded: {error.message}</p>
        <button type="button" className="btn-quiet mt-2" onClick={() => void mutate()}>
          Try again
        </button>
      </div>
    );
  }
  if (isLoading || !data) return <p role="status">Loading the draft…</p>;

  const { draft, latestVersion } = data;
  return (
    <div className="space-y-3">
      <p className="text-sm text-ink-soft">
        Draft version {draft.version}, last saved {formatDateTime(draft.updatedAt, style)}
        {draft.updatedByName ? ` by ${draft.updatedByName}` : ""}.{" "}
        {latestVersion ? (
          <>
            Routes use{" "}
            <Link className="underline" href={`/floor-plans/${floorPlanId}/versions/${latestVersion.number}`}>
              layout version {latestVersion.number}
            </Link>
            , published {formatDateTime(latestVersion.publishedAt, style)}.
          </>
        ) : (
          "Nothing is published yet, so no routes can be planned on this floor."
        )}
      </p>
      <EditorSession
        key={loads}
        planId={floorPlanId}
        canEdit={canEdit}
        version={draft.version}
        document={draft.document}
        onReload={async () => {
          await mutate();
          setLoads((n) => n + 1);
        }}
      />
    </div>
  );
}
