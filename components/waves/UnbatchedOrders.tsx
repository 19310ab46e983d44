import type { WaveDTO } from "@/lib/contracts/waves";

/**
 * Every order of the plan no batch holds, with its reason: all of them (a long list scrolls), since
 * each is an order that will not be picked in this wave.
 */
export function UnbatchedOrders({ wave }: { wave: WaveDTO }) {
  const n = wave.unbatchable.length;
  if (n === 0) return null;
  const orders = n === 1 ? "1 order" : `${n} orders`;
  const released = wave.status === "released";
  return (
    <section className="notice-error mt-4" role="alert" aria-labelledby="unbatched-title">
      <h2 id="unbatched-title" className="text-lg font-semibold">
        ⚠ {orders} could not be batched
      </h2>
      <p className="mt-1">
        {released
          ? `${n === 1 ? "It" : "They"} went back to open orders when the wave was released, with the reason on the orders page. Fix what is named below, then start a new wave to pick ${n === 1 ? "it" : "them"}.`
          : `No batch holds ${n === 1 ? "it" : "them"}, so releasing this wave does not pick ${n === 1 ? "it" : "them"}: on release ${n === 1 ? "it goes" : "they go"} back to open orders, with the reason kept. Or fix what is named below and re-plan to include ${n === 1 ? "it" : "them"}.`}
      </p>
      <div className="mt-3 max-h-96 overflow-y-auto rounded-md border border-rack-light bg-paper-raised">
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Orders no batch holds, and why</caption>
          <thead className="sticky top-0 bg-paper-sunk">
            <tr>
              <th scope="col" className="px-3 py-2">
                Order
              </th>
              <th scope="col" className="px-3 py-2">
                Why it could not be batched
              </th>
            </tr>
          </thead>
          <tbody>
            {wave.unbatchable.map((u) => (
              <tr key={u.orderId} className="border-t border-rack-light align-top">
                <td className="px-3 py-2 font-semibold whitespace-nowrap">{u.orderNumber ?? `id ${u.orderId}`}</td>
                <td className="px-3 py-2">{u.reason}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
