import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requireRole } from "@/lib/auth/guard";
import { pageId } from "@/lib/http/page-params";
import { roleMay } from "@/lib/auth/permissions";
import { getWave } from "@/db/waves";
import { pickListsOf } from "@/lib/print/pick-list-data";
import { PickList } from "@/components/print/PickList";
import { PrintButton } from "@/components/print/PrintButton";

export const metadata: Metadata = { title: "Pick list" };

export default async function BatchPrintPage({ params }: { params: Promise<{ id: string; number: string }> }) {
  const { id, number } = await params;
  const user = await requireRole("waves.read", `/waves/${id}/batches/${number}/print`);
  const n = pageId(number);
  const wave = await getWave(user.siteId, pageId(id));
  const [list] = wave ? await pickListsOf(user.siteId, wave, [n]) : [];
  if (!wave || !list) notFound();
  return (
    <>
      <PrintButton waveId={wave.id} numbers={[list.batch.number]} canRecord={roleMay(user.role, "waves.plan")} />
      <PickList {...list} />
    </>
  );
}
