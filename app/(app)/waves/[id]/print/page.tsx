import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { requireRole } from "@/lib/auth/guard";
import { pageId } from "@/lib/http/page-params";
import { roleMay } from "@/lib/auth/permissions";
import { getWave } from "@/db/waves";
import { pickListsOf } from "@/lib/print/pick-list-data";
import { PickList } from "@/components/print/PickList";
import { PrintButton } from "@/components/print/PrintButton";

export const metadata: Metadata = { title: "Pick lists" };

export default async function WavePrintPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requireRole("waves.read", `/waves/${id}/print`);
  const wave = await getWave(user.siteId, pageId(id));
  if (!wave) notFound();
  const lists = await pickListsOf(user.siteId, wave);
  return (
    <>
      <h1 className="mb-3 print:hidden">Pick lists: {wave.name}</h1>
      {lists.length === 0 ? (
        <p>Plan the wave first: it has no batches yet.</p>
      ) : (
        <PrintButton
          waveId={wave.id}
          numbers={lists.map((l) => l.batch.number)}
          canRecord={roleMay(user.role, "waves.plan")}
        />
      )}
      {lists.map((l) => (
        <PickList key={l.label} {...l} />
      ))}
    </>
  );
}
