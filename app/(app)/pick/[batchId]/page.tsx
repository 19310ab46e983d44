import type { Metadata } from "next";
import Link from "next/link";
import { headers } from "next/headers";
import { forbidden, notFound } from "next/navigation";
import { requireRole } from "@/lib/auth/guard";
import { pageId } from "@/lib/http/page-params";
import { clientIp } from "@/lib/http/client-ip";
import { BatchRefusal, workableBatch } from "@/lib/picking/access";
import { pickView } from "@/lib/picking/view";
import { PickScreen } from "@/components/picking/PickScreen";

export const metadata: Metadata = { title: "Pick" };

export default async function PickPage({ params }: { params: Promise<{ batchId: string }> }) {
  const { batchId } = await params;
  const path = `/pick/${batchId}`;
  const user = await requireRole("picks.work", path);
  const id = pageId(batchId);
  const batch = await workableBatch(user, id, clientIp(await headers()), path).catch((e: unknown) => {
    if (!(e instanceof BatchRefusal)) throw e;
    return e;
  });
  if (batch instanceof BatchRefusal) {
    if (batch.status === 404) notFound();
    if (batch.status === 403 && !batch.movedAway) forbidden();
    return (
      <div className="mx-auto max-w-md">
        <h1>Batch {batch.batch?.number ?? id}</h1>
        <p className="notice-error mt-4" data-testid="batch-gone">
          {batch.message}
        </p>
        <Link className="btn-quiet mt-4 w-full" href="/my-batches">
          Back to my batches
        </Link>
      </div>
    );
  }
  const { view, document } = await pickView(user.siteId, batch);
  return <PickScreen initial={view} document={document} />;
}
