import type { Metadata } from "next";
import Link from "next/link";
import { requireRole } from "@/lib/auth/guard";
import { roleMay } from "@/lib/auth/permissions";
import { listWaves } from "@/db/waves";
import { waveLayoutChoices } from "@/lib/layout-versions/choices";
import { PageHeader } from "@/components/PageHeader";
import { EmptyState } from "@/components/EmptyState";
import { NewWaveForm } from "@/components/waves/NewWaveForm";
import { metres, savingsPct } from "@/lib/format/units";

export const metadata: Metadata = { title: "Waves" };

const STATUS = { draft: "◌ Draft", planned: "◐ Planned", released: "● Released" } as const;

export default async function WavesPage() {
  const user = await requireRole("waves.read", "/waves");
  const [waves, layouts] = await Promise.all([listWaves(user.siteId), waveLayoutChoices(user.siteId)]);
  return (
    <>
      <PageHeader
        title="Waves"
        lead="Groups of orders cut into cart-sized batches, each with an exact walking route and its savings against the usual walk through the aisles."
      />
      {waves.length === 0 ? (
        <EmptyState title="No waves yet">Import orders, then start a wave below.</EmptyState>
      ) : (
        <div className="overflow-x-auto rounded-lg border border-rack-light bg-paper-raised">
          <table className="w-full text-left">
            <thead className="bg-paper-sunk">
              <tr>
                {["Wave", "Status", "Orders", "Batches", "Planned walk", "Usual walk", "Savings", "Layout"].map((h) => (
                  <th key={h} scope="col" className="px-3 py-2">
                    {h}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {waves.map((w) => (
                <tr key={w.id} className="border-t border-rack-light">
                  <td className="px-3 py-2">
                    <Link className="font-semibold underline" href={`/waves/${w.id}`}>
                      {w.name}
                    </Link>
                  </td>
                  <td className="px-3 py-2">{STATUS[w.status]}</td>
                  <td className="px-3 py-2">{w.orderCount}</td>
                  <td className="px-3 py-2">{w.batchCount || "—"}</td>
                  <td className="px-3 py-2">{w.distanceMm === null ? "—" : metres(w.distanceMm)}</td>
                  <td className="px-3 py-2">{w.baselineMm === null ? "—" : metres(w.baselineMm)}</td>
                  <td className="px-3 py-2">
                    {w.distanceMm === null || w.baselineMm === null ? "—" : savingsPct(w.distanceMm, w.baselineMm)}
                  </td>
                  <td className="px-3 py-2">
                    {w.floorPlanName} v{w.layoutVersionNumber}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {roleMay(user.role, "waves.plan") && <NewWaveForm layouts={layouts} />}
    </>
  );
}
