import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requireRole } from "@/lib/auth/guard";
import { roleMay } from "@/lib/auth/permissions";
import { getWave } from "@/db/waves";
import { pickListsOf } from "@/lib/print/pick-list-data";
import { PickList } from "@/components/print/PickList";
import { PrintButton } from "@/components/print/PrintButton";

export const metadata: Metadata = { title: "Pick list" };

export default async function BatchPrintPage({ params }: { params: Promise<{ id: string; number: string }> }) {
  const { id, number } = await params;
  const user = await requireRole("waves.read", `/waves/${id}/batches/${number}/print`);
  const wave = /^\d{1,9}$/.test(id) ? await getWave(user.siteId, Number(id)) : null;
  const n = /^\d{1,9}$/.test(number) ? Number(number) : null;
  const [list] = wave && n ? await pickListsOf(user.siteId, wave, [n]) : [];
  if (!wave || !list) notFound();
  return (
    <>
      <PrintButton waveId={wave.id} numbers={[list.batch.number]} canRecord={roleMay(user.role, "waves.plan")} />
      <PickList {...list} />
    </>
  );
}
