import type { Metadata } from "next";
import Link from "next/link";
import { headers } from "next/headers";
import { forbidden, notFound } from "next/navigation";
import { requireRole } from "@/lib/auth/guard";
import { clientIp } from "@/lib/http/client-ip";
import { mayWorkBatch } from "@/lib/picking/access";
import { pickView } from "@/lib/picking/view";
import { PickScreen } from "@/components/picking/PickScreen";

export const metadata: Metadata = { title: "Pick" };

export default async function PickPage({ params }: { params: Promise<{ batchId: string }> }) {
  const { batchId } = await params;
  const path = `/pick/${batchId}`;
  const user = await requireRole("picks.work", path);
  const id = /^\d{1,9}$/.test(batchId) ? Number(batchId) : null;
  if (!id) notFound();
  const access = await mayWorkBatch(user, id, clientIp(await headers()), path);
  if (!access.ok && access.status === 404) notFound();
  if (!access.ok && access.status === 403) forbidden();
  if (!access.ok) {
    return (
      <div className="mx-auto max-w-md">
        <h1>Batch {access.batch?.number ?? id}</h1>
        <p className="notice-error mt-4">{access.message}</p>
        <Link className="btn-quiet mt-4 w-full" href="/my-batches">Back to my batches</Link>
      </div>
    );
  }
  const { view, document } = await pickView(user.siteId, access.batch);
  return <PickScreen initial={view} document={document} />;
}
